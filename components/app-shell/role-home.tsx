import type { ReactNode } from 'react';

/** The top of each role's home screen: the fleet and what this view is for. */
export function RoleHome({
  fleetName,
  title,
  children,
}: {
  fleetName: string | null;
  title: string;
  children: ReactNode;
}) {
  return (
    <section className="space-y-4">
      <p className="text-lg text-muted">{fleetName}</p>
      <h1 className="text-3xl font-extrabold">{title}</h1>
      {children}
    </section>
  );
}
