import { defineRoute } from '@/lib/api/define-route';
import { photoParamsSchema } from '@/lib/schemas/inspections';
import { MAX_PHOTO_BYTES } from '@/lib/services/inspections/save-photo';
import { saveRepairPhoto } from '@/lib/services/defects/save-repair-photo';

// A photo of the repair: the bytes are the body, the type is read from them.
export const PUT = defineRoute(
  { roles: ['mechanic'], params: photoParamsSchema, rawBody: { maxBytes: MAX_PHOTO_BYTES } },
  async ({ user, params, bytes }) => {
    const { attachment, created } = await saveRepairPhoto({
      fleetId: user.fleetId,
      actorId: user.id,
      defectId: params.id,
      photoId: params.photoId,
      bytes: bytes ?? new Uint8Array(),
    });
    return Response.json({ attachment }, { status: created ? 201 : 200 });
  },
);
