// Roles and where each one lands. Universal: used by pages, handlers and the sign-in screen.

export const roles = ['driver', 'mechanic', 'supervisor', 'trainer', 'admin'] as const;
export type Role = (typeof roles)[number];

export const roleHome: Record<Role, string> = {
  driver: '/driver',
  mechanic: '/mechanic',
  supervisor: '/supervisor',
  trainer: '/trainer',
  admin: '/admin',
};

export const roleLabel: Record<Role, string> = {
  driver: 'Driver',
  mechanic: 'Mechanic',
  supervisor: 'Supervisor',
  trainer: 'Trainer',
  admin: 'Admin',
};

/** The page a user lands on after signing in: the first of their roles in the order above. */
export function findHomeFor(userRoles: readonly Role[]): string {
  const first = roles.find((r) => userRoles.includes(r));
  return first ? roleHome[first] : '/';
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (roles as readonly string[]).includes(value);
}
