import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { renderReportPdf } from '@/lib/services/reports/render-report-pdf';

// The printable report for a roadside officer or an auditor (49 CFR 396.11(a)(2)–(3)).
export const GET = defineRoute(
  { roles: ['driver', 'mechanic', 'supervisor'], params: idParamsSchema },
  async ({ user, params }) => {
    const { pdf, fileName } = await renderReportPdf({ fleetId: user.fleetId, id: params.id });
    return new Response(new Uint8Array(pdf), {
      headers: {
        'content-type': 'application/pdf',
        'content-disposition': `inline; filename="${fileName}"`,
        'cache-control': 'no-store',
      },
    });
  },
);
