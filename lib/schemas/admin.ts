// What the admin overview receives from the server. Universal.
import type { Role } from '@/lib/auth/roles';
import type { FleetSettings } from './fleet';

/** The admin's overview: people by role, units by state, the settings and the latest changes. */
export type AdminSummary = {
  fleet: FleetSettings;
  timezone: string;
  users: { active: number; inactive: number; byRole: Record<Role, number> };
  units: { tractors: number; trailers: number; outOfService: number; retired: number };
  recent: { id: number; action: string; detail: unknown; createdAt: string; actorName: string | null }[];
};
