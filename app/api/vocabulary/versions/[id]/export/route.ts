import { z } from 'zod';
import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { exportGrammar, formatGrammarFile, grammarFiles } from '@/lib/services/vocabulary/export-grammar';

const exportQuerySchema = z.object({ file: z.enum(grammarFiles).optional() });

// A version in the grammars/ file format: ?file=vocabulary (etc.) for one file, else all five in one document.
export const GET = defineRoute(
  { roles: ['trainer'], params: idParamsSchema, query: exportQuerySchema },
  async ({ user, params, query }) => {
    const out = await exportGrammar({ fleetId: user.fleetId, id: params.id, file: query.file });
    return new Response(formatGrammarFile(out.body), {
      headers: {
        'content-type': 'application/json; charset=utf-8',
        'content-disposition': `attachment; filename="${out.filename}"`,
        'cache-control': 'no-store',
      },
    });
  },
);
