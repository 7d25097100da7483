import type { Config } from 'tailwindcss';

// Loaded from app/globals.css with @config. Colours are CSS variables so that the day and
// night themes swap in one place (app/globals.css).
export default {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ground: 'rgb(var(--ground) / <alpha-value>)', // page background
        panel: 'rgb(var(--panel) / <alpha-value>)', // raised surfaces
        ink: 'rgb(var(--ink) / <alpha-value>)', // text
        muted: 'rgb(var(--muted) / <alpha-value>)', // secondary text
        edge: 'rgb(var(--edge) / <alpha-value>)', // thick outlines
        vest: 'rgb(var(--vest) / <alpha-value>)', // the primary action, safety-vest yellow-green
        'on-vest': 'rgb(var(--on-vest) / <alpha-value>)',
        pass: 'rgb(var(--pass) / <alpha-value>)',
        minor: 'rgb(var(--minor) / <alpha-value>)',
        major: 'rgb(var(--major) / <alpha-value>)',
        'on-major': 'rgb(var(--on-major) / <alpha-value>)',
      },
      fontFamily: { sans: ['var(--font-body)', 'system-ui', 'sans-serif'] },
      minHeight: { target: '4rem' },
      minWidth: { target: '4rem' },
      borderWidth: { slab: '3px' },
    },
  },
} satisfies Config;
