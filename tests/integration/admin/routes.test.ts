import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readError, readJson } from '../../setup/read-json';
import { getTestDb } from '../../setup/test-db';
import { adminRouteCases } from './admin-routes';
import { makeAdminFleet } from './helpers';

let ctx: Awaited<ReturnType<typeof makeAdminFleet>>;
beforeAll(async () => {
  ctx = await makeAdminFleet();
});
afterAll(() => getTestDb().destroy());

describe.each(adminRouteCases)('$method $path ($name)', (route) => {
  it('answers 401 without a session', async () => {
    const res = await route.call();
    expect(res.status).toBe(401);
    expect((await readError(res)).code).toBe('unauthenticated');
  });

  it('answers 403 to a driver', async () => {
    const res = await route.call(ctx.driverCookie);
    expect(res.status).toBe(403);
    expect((await readError(res)).message).toMatch(/admin role/);
  });

  it('answers 2xx to an admin', async () => {
    const res = await route.call(ctx.adminCookie);
    const body = await readJson<unknown>(res);
    expect(res.status, JSON.stringify(body)).toBe(
      route.method === 'POST' && !route.path.endsWith('/retire') ? 201 : 200,
    );
  });
});
