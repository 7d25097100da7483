'use client';

import { useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';

type Theme = 'day' | 'night';

function currentTheme(): Theme {
  const set = document.documentElement.dataset.theme;
  if (set === 'day' || set === 'night') return set;
  return window.matchMedia('(prefers-color-scheme: dark)').matches ? 'night' : 'day';
}

/** Day / night switch; kept in a cookie so the server paints the right theme first. */
export function ThemeToggle() {
  const [theme, setTheme] = useState<Theme | null>(null);
  useEffect(() => setTheme(currentTheme()), []);
  const next: Theme = theme === 'night' ? 'day' : 'night';
  return (
    <Button
      size="touch"
      aria-label={`Switch to ${next} theme`}
      onClick={() => {
        document.documentElement.dataset.theme = next;
        document.cookie = `rigcall-theme=${next}; path=/; max-age=31536000; samesite=lax`;
        setTheme(next);
      }}
    >
      {theme === null ? 'Theme' : next === 'night' ? '☾ Night' : '☀ Day'}
    </Button>
  );
}
