import { defineRoute } from '@/lib/api/define-route';
import { checkHealth } from '@/lib/services/platform/check-health';

export const dynamic = 'force-dynamic';

export const GET = defineRoute({ roles: 'public' }, async () => {
  const health = await checkHealth();
  return Response.json(health, { status: health.ok ? 200 : 503, headers: { 'cache-control': 'no-store' } });
});
