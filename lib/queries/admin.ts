// Client data for the admin screens: key factories, query options and mutation hooks.
// Components never write a literal key; mutations invalidate through these factories.
import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { fetchJson } from '@/lib/http/fetch-json';
import type { FleetSettings, UpdateFleetSettingsBody } from '@/lib/schemas/fleet';
import type { CreateUnitBody, ListUnitsQuery, RetireUnitBody, UnitDto, UpdateUnitBody } from '@/lib/schemas/units';
import type { AdminUser, InviteUserBody, Role, UpdateUserBody } from '@/lib/schemas/users';

export const adminUserKeys = {
  all: ['admin', 'users'] as const,
  list: () => [...adminUserKeys.all, 'list'] as const,
  detail: (id: string) => [...adminUserKeys.all, 'detail', id] as const,
};

export const adminUnitKeys = {
  all: ['admin', 'units'] as const,
  list: (filters: ListUnitsQuery = {}) => [...adminUnitKeys.all, 'list', filters] as const,
  detail: (id: string) => [...adminUnitKeys.all, 'detail', id] as const,
};

export const fleetSettingsKeys = {
  all: ['admin', 'fleet'] as const,
  detail: () => [...fleetSettingsKeys.all, 'detail'] as const,
};

export const adminUsersQuery = () =>
  queryOptions({
    queryKey: adminUserKeys.list(),
    queryFn: async () => (await fetchJson<{ users: AdminUser[] }>('/api/admin/users')).users,
  });

export const adminUnitsQuery = (filters: ListUnitsQuery = {}) =>
  queryOptions({
    queryKey: adminUnitKeys.list(filters),
    queryFn: async () => {
      const qs = new URLSearchParams();
      for (const [k, v] of Object.entries(filters)) if (typeof v === 'string') qs.set(k, v);
      return (await fetchJson<{ units: UnitDto[] }>(`/api/admin/units${qs.size ? `?${qs}` : ''}`)).units;
    },
  });

export const adminUnitQuery = (id: string) =>
  queryOptions({
    queryKey: adminUnitKeys.detail(id),
    queryFn: async () => (await fetchJson<{ unit: UnitDto }>(`/api/admin/units/${id}`)).unit,
  });

export const fleetSettingsQuery = () =>
  queryOptions({
    queryKey: fleetSettingsKeys.detail(),
    queryFn: async () => (await fetchJson<{ fleet: FleetSettings }>('/api/admin/fleet')).fleet,
  });

export function useInviteUserMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteUserBody) =>
      fetchJson<{ invitation: { email: string; name: string; roles: Role[] } }>('/api/admin/users', {
        method: 'POST',
        json: body,
      }),
    onSuccess: () => qc.invalidateQueries({ queryKey: adminUserKeys.all }),
  });
}

export function useUpdateUserMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: UpdateUserBody & { id: string }) =>
      fetchJson<{ user: AdminUser }>(`/api/admin/users/${id}`, { method: 'PATCH', json: body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: adminUserKeys.all }),
  });
}

export function useCreateUnitMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateUnitBody) =>
      fetchJson<{ unit: UnitDto }>('/api/admin/units', { method: 'POST', json: body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: adminUnitKeys.all }),
  });
}

export function useUpdateUnitMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateUnitBody) =>
      fetchJson<{ unit: UnitDto }>(`/api/admin/units/${id}`, { method: 'PATCH', json: body }),
    onSuccess: ({ unit }) => {
      qc.setQueryData(adminUnitKeys.detail(id), unit);
      return qc.invalidateQueries({ queryKey: adminUnitKeys.all });
    },
  });
}

export function useRetireUnitMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: RetireUnitBody) =>
      fetchJson<{ unit: UnitDto }>(`/api/admin/units/${id}/retire`, { method: 'POST', json: body }),
    onSuccess: ({ unit }) => {
      qc.setQueryData(adminUnitKeys.detail(id), unit);
      return qc.invalidateQueries({ queryKey: adminUnitKeys.all });
    },
  });
}

export function useUpdateFleetSettingsMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateFleetSettingsBody) =>
      fetchJson<{ fleet: FleetSettings }>('/api/admin/fleet', { method: 'PATCH', json: body }),
    onSuccess: ({ fleet }) => qc.setQueryData(fleetSettingsKeys.detail(), fleet),
  });
}
