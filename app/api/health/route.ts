import { defineRoute } from '@/lib/api/define-route';
import { checkHealth } from '@/lib/services/platform/check-health';

export const dynamic = 'force-dynamic';

// Anyone may ask whether the app and its services are up; only a signed-in user sees the version.
export const GET = defineRoute({ roles: 'public' }, async ({ user }) => {
  const { version, ...health } = await checkHealth();
  return Response.json(user ? { ...health, version } : health, {
    status: health.ok ? 200 : 503,
    headers: { 'cache-control': 'no-store' },
  });
});
