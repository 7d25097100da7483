import { z } from 'zod';
import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { readPhoto, renderTamperedPhotoSvg } from '@/lib/services/inspections/read-photo';

// A photo, checked against the SHA-256 stored with it on every read. A mismatch is a 409 whose
// body is a warning image (so an <img> shows it in place of the photo) and whose header says why.
export const GET = defineRoute(
  {
    roles: ['driver', 'mechanic', 'supervisor'],
    params: idParamsSchema,
    query: z.object({ size: z.enum(['full', 'thumb']).default('full') }),
  },
  async ({ user, params, query }) => {
    const photo = await readPhoto({ fleetId: user.fleetId, actorId: user.id, id: params.id, size: query.size });
    if (!photo.ok)
      return new Response(renderTamperedPhotoSvg(photo.message), {
        status: 409,
        headers: {
          'content-type': 'image/svg+xml; charset=utf-8',
          'cache-control': 'no-store',
          'x-content-type-options': 'nosniff',
          'x-rigcall-integrity': 'mismatch',
          'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'",
        },
      });
    return new Response(Buffer.from(photo.bytes), {
      headers: {
        'content-type': photo.contentType,
        // Not cached long: a later check must be able to catch a swap.
        'cache-control': 'private, max-age=300',
        'x-content-type-options': 'nosniff',
        'x-rigcall-integrity': 'ok',
      },
    });
  },
);
