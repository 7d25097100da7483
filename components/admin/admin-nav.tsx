import { NavTabs } from '@/components/ui/tabs';

const links = [
  { href: '/admin', label: 'Overview', match: 'exact' as const },
  { href: '/admin/users', label: 'People' },
  { href: '/admin/units', label: 'Units' },
  { href: '/admin/settings', label: 'Fleet settings' },
  { href: '/admin/mail', label: 'Sent mail' },
];

/** The admin's sections; the current one is marked for sight and for screen readers. */
export function AdminNav() {
  return <NavTabs items={links} label="Administration" className="mb-6 border-b-slab border-edge pb-3" />;
}
