import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { MAX_SIGNATURE_BYTES, saveSignature } from '@/lib/services/inspections/save-signature';

// The drawn signature's PNG bytes are the body.
export const PUT = defineRoute(
  { roles: ['driver'], params: idParamsSchema, rawBody: { maxBytes: MAX_SIGNATURE_BYTES } },
  async ({ user, params, bytes }) => {
    const { signatureKey, created } = await saveSignature({
      fleetId: user.fleetId,
      actorId: user.id,
      inspectionId: params.id,
      bytes: bytes ?? new Uint8Array(),
    });
    return Response.json({ signatureKey }, { status: created ? 201 : 200 });
  },
);
