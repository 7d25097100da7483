import Link from 'next/link';
import type { SessionUser } from '@/lib/schemas/session';
import { roleHome, roleLabel, roles, type Role } from '@/lib/auth/roles';
import { ConnectionStatus } from './connection-status';
import { SignOutButton } from './sign-out-button';
import { ThemeToggle } from './theme-toggle';
import { buttonClass } from '@/components/ui/button';

/** The bar on every signed-in screen: who you are, which view, switch view, theme, sign out. */
export function AppHeader({ user, view }: { user: SessionUser; view: Role }) {
  const views = roles.filter((r) => user.roles.includes(r));
  return (
    <header className="border-b-slab border-edge bg-panel">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-3 px-4 py-3">
        <Link
          href={roleHome[view]}
          className="mr-auto flex min-h-target items-center text-2xl font-extrabold tracking-tight"
        >
          Rig<span className="rounded bg-vest px-1 text-on-vest">Call</span>
        </Link>
        <p className="text-lg" data-testid="signed-in-as">
          <span className="font-bold">{user.name}</span> <span className="text-muted">· {roleLabel[view]}</span>
        </p>
        {view === 'driver' && <ConnectionStatus />}
        {views.length > 1 && (
          <nav aria-label="Switch view" className="flex flex-wrap gap-2">
            {views
              .filter((r) => r !== view)
              .map((r) => (
                <Link key={r} href={roleHome[r]} className={buttonClass('plain', 'touch')}>
                  {roleLabel[r]} view
                </Link>
              ))}
          </nav>
        )}
        <ThemeToggle />
        <SignOutButton />
      </div>
    </header>
  );
}
