// One case per admin route, with a valid request, for the fleet-wide route × role matrix.
// `call(cookie)` acts in the fleet of the cookie's user: routes with an id first make a
// throwaway user or unit there, so an admin's call succeeds and nothing shared is touched.
import { randomUUID } from 'node:crypto';
import { decode } from 'next-auth/jwt';
import { GET as getFleet, PATCH as patchFleet } from '@/app/api/admin/fleet/route';
import { POST as retireUnit } from '@/app/api/admin/units/[id]/retire/route';
import { GET as getUnit, PATCH as patchUnit } from '@/app/api/admin/units/[id]/route';
import { GET as listUnits, POST as createUnit } from '@/app/api/admin/units/route';
import { GET as getUser, PATCH as patchUser } from '@/app/api/admin/users/[id]/route';
import { GET as listUsers, POST as inviteUser } from '@/app/api/admin/users/route';
import { makeUnit, makeUser } from '../../../db/factories';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { makeVin, tractorAxles } from './helpers';

export type AdminRouteCase = {
  name: string;
  method: string;
  path: string;
  call: (cookie?: string) => Promise<Response>;
};

/** The fleet of the user a session cookie belongs to, or null without a cookie. */
async function fleetOfCookie(cookie?: string): Promise<string | null> {
  if (!cookie) return null;
  const token = await decode({ token: cookie.replace(/^[^=]+=/, ''), secret: process.env.NEXTAUTH_SECRET ?? '' });
  return typeof token?.fleetId === 'string' ? token.fleetId : null;
}

async function throwawayUserId(cookie?: string): Promise<string> {
  const fleetId = await fleetOfCookie(cookie);
  if (!fleetId) return randomUUID();
  return (await makeUser(getTestDb(), { fleetId, roles: ['driver'], name: 'Matrix Target' })).id;
}

async function throwawayUnitId(cookie?: string): Promise<string> {
  const fleetId = await fleetOfCookie(cookie);
  if (!fleetId) return randomUUID();
  return (
    await makeUnit(getTestDb(), {
      fleetId,
      kind: 'tractor',
      unitNumber: `M${randomUUID().slice(0, 7).toUpperCase()}`,
      axles: JSON.stringify(tractorAxles),
    })
  ).id;
}

const newUnitBody = () => ({
  kind: 'tractor',
  unitNumber: `M${randomUUID().slice(0, 7).toUpperCase()}`,
  plate: 'MX 1001',
  plateJurisdiction: 'IA',
  vin: makeVin(),
  make: 'Kestrel',
  model: 'K70',
  year: 2022,
  axles: tractorAxles,
});

export const adminRouteCases: AdminRouteCase[] = [
  {
    name: 'list users',
    method: 'GET',
    path: '/api/admin/users',
    call: (cookie) => callRoute(listUsers, makeRequest('/api/admin/users', { cookie })),
  },
  {
    name: 'invite a user',
    method: 'POST',
    path: '/api/admin/users',
    call: (cookie) =>
      callRoute(
        inviteUser,
        makeRequest('/api/admin/users', {
          method: 'POST',
          cookie,
          json: { name: 'Matrix Invitee', email: `matrix-${randomUUID().slice(0, 8)}@test.example`, roles: ['driver'] },
        }),
      ),
  },
  {
    name: 'read a user',
    method: 'GET',
    path: '/api/admin/users/[id]',
    call: async (cookie) => {
      const id = await throwawayUserId(cookie);
      return callRoute(getUser, makeRequest(`/api/admin/users/${id}`, { cookie }), { id });
    },
  },
  {
    name: 'change a user',
    method: 'PATCH',
    path: '/api/admin/users/[id]',
    call: async (cookie) => {
      const id = await throwawayUserId(cookie);
      return callRoute(
        patchUser,
        makeRequest(`/api/admin/users/${id}`, { method: 'PATCH', cookie, json: { roles: ['driver', 'mechanic'] } }),
        { id },
      );
    },
  },
  {
    name: 'list units',
    method: 'GET',
    path: '/api/admin/units',
    call: (cookie) => callRoute(listUnits, makeRequest('/api/admin/units', { cookie })),
  },
  {
    name: 'add a unit',
    method: 'POST',
    path: '/api/admin/units',
    call: (cookie) =>
      callRoute(createUnit, makeRequest('/api/admin/units', { method: 'POST', cookie, json: newUnitBody() })),
  },
  {
    name: 'read a unit',
    method: 'GET',
    path: '/api/admin/units/[id]',
    call: async (cookie) => {
      const id = await throwawayUnitId(cookie);
      return callRoute(getUnit, makeRequest(`/api/admin/units/${id}`, { cookie }), { id });
    },
  },
  {
    name: 'edit a unit',
    method: 'PATCH',
    path: '/api/admin/units/[id]',
    call: async (cookie) => {
      const id = await throwawayUnitId(cookie);
      return callRoute(
        patchUnit,
        makeRequest(`/api/admin/units/${id}`, { method: 'PATCH', cookie, json: { make: 'Ardent', year: 2020 } }),
        { id },
      );
    },
  },
  {
    name: 'retire a unit',
    method: 'POST',
    path: '/api/admin/units/[id]/retire',
    call: async (cookie) => {
      const id = await throwawayUnitId(cookie);
      return callRoute(
        retireUnit,
        makeRequest(`/api/admin/units/${id}/retire`, { method: 'POST', cookie, json: { reason: 'sold' } }),
        { id },
      );
    },
  },
  {
    name: 'read fleet settings',
    method: 'GET',
    path: '/api/admin/fleet',
    call: (cookie) => callRoute(getFleet, makeRequest('/api/admin/fleet', { cookie })),
  },
  {
    name: 'change fleet settings',
    method: 'PATCH',
    path: '/api/admin/fleet',
    call: async (cookie) => {
      // Sends the fleet's current post-trip minimum back: a valid change that changes nothing.
      const fleetId = await fleetOfCookie(cookie);
      const current = fleetId
        ? await getTestDb()
            .selectFrom('fleet')
            .select('minPosttripMinutes')
            .where('id', '=', fleetId)
            .executeTakeFirst()
        : undefined;
      return callRoute(
        patchFleet,
        makeRequest('/api/admin/fleet', {
          method: 'PATCH',
          cookie,
          json: { minPosttripMinutes: current?.minPosttripMinutes ?? 5 },
        }),
      );
    },
  },
];
