'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';

const links = [
  { href: '/admin', label: 'Overview' },
  { href: '/admin/users', label: 'People' },
  { href: '/admin/units', label: 'Units' },
  { href: '/admin/settings', label: 'Fleet settings' },
  { href: '/admin/mail', label: 'Sent mail' },
];

/** The admin's sections; the current one is marked for sight and for screen readers. */
export function AdminNav() {
  const path = usePathname();
  return (
    <nav aria-label="Administration" className="mb-6 flex flex-wrap gap-2 border-b-slab border-edge pb-3">
      {links.map((l) => {
        const current = l.href === '/admin' ? path === '/admin' : path.startsWith(l.href);
        return (
          <Link
            key={l.href}
            href={l.href}
            aria-current={current ? 'page' : undefined}
            className={`inline-flex min-h-12 items-center rounded-md border-slab px-4 text-lg font-bold ${current ? 'border-edge bg-ink text-ground' : 'border-transparent hover:border-edge'}`}
          >
            {l.label}
          </Link>
        );
      })}
    </nav>
  );
}
