import { defineRoute } from '@/lib/api/define-route';
import { photoParamsSchema, photoQuerySchema } from '@/lib/schemas/inspections';
import { MAX_PHOTO_BYTES, savePhoto } from '@/lib/services/inspections/save-photo';

// The photo's bytes are the body (any declared type: the server reads the bytes themselves).
export const PUT = defineRoute(
  { roles: ['driver'], params: photoParamsSchema, query: photoQuerySchema, rawBody: { maxBytes: MAX_PHOTO_BYTES } },
  async ({ user, params, query, bytes }) => {
    const { attachment, created } = await savePhoto({
      fleetId: user.fleetId,
      actorId: user.id,
      inspectionId: params.id,
      photoId: params.photoId,
      stepId: query.stepId ?? null,
      bytes: bytes ?? new Uint8Array(),
    });
    return Response.json({ attachment }, { status: created ? 201 : 200 });
  },
);
