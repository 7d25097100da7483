import { z } from 'zod';
import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/errors';
import { idParamsSchema } from '@/lib/schemas/common';
import { getObjectBytes } from '@/lib/storage';

export const GET = defineRoute(
  {
    roles: ['driver', 'mechanic', 'supervisor'],
    params: idParamsSchema,
    query: z.object({ size: z.enum(['full', 'thumb']).default('full') }),
  },
  async ({ user, params, query }) => {
    const row = await getDb()
      .selectFrom('attachment')
      .select(['objectKey', 'contentType'])
      .where('fleetId', '=', user.fleetId)
      .where('id', '=', params.id)
      .executeTakeFirst();
    if (!row) throw new AppError('not_found', 'No such photo in your fleet.');
    const key = query.size === 'thumb' ? row.objectKey.replace(/\.jpg$/, '.thumb.jpg') : row.objectKey;
    const { bytes } = await getObjectBytes(key);
    return new Response(Buffer.from(bytes), {
      headers: {
        'content-type': row.contentType,
        'cache-control': 'private, max-age=86400',
        'x-content-type-options': 'nosniff',
      },
    });
  },
);
