// The printed report read back: page numbers "n of N", the drawn signature as an image, and the
// readings that passed with their limits (49 CFR 396.11(a): the report names what was inspected).
import sharp from 'sharp';
import { extractText, getDocumentProxy } from 'unpdf';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderReportPdf } from '@/lib/services/reports/render-report-pdf';
import { putObject } from '@/lib/storage';
import { makeOfficeFleet, type OfficeFleet } from './office-fixtures';

let f: OfficeFleet;
let reportId: string;
beforeAll(async () => {
  f = await makeOfficeFleet({ history: 6, name: 'PDF fleet' });
  const r = await f.db
    .selectFrom('inspection')
    .select('id')
    .where('fleetId', '=', f.fleet.id)
    .where('kind', '=', 'pre_trip')
    .orderBy('startedAt', 'desc')
    .executeTakeFirstOrThrow();
  reportId = r.id;
}, 120_000);
afterAll(() => f.db.destroy());

async function read(pdf: Buffer) {
  const doc = await getDocumentProxy(new Uint8Array(pdf));
  const { text, totalPages } = await extractText(doc, { mergePages: false });
  return { pages: text.map((t) => t.replace(/\s+/g, ' ')), totalPages, raw: pdf.toString('latin1') };
}

describe('report PDF read back', () => {
  it('numbers every page "Page n of N" and lists the passing readings with their limits and sources', async () => {
    const { pdf } = await renderReportPdf({ fleetId: f.fleet.id, id: reportId });
    const { pages, totalPages } = await read(pdf);
    expect(totalPages).toBeGreaterThanOrEqual(1);
    pages.forEach((t, i) => expect(t).toContain(`Page ${i + 1} of ${totalPages}`));
    const all = pages.join(' ');
    expect(all).toContain('READINGS WITHIN THEIR LIMITS');
    // the seeded pre-trip takes a steer tread depth in 32nds, judged against 49 CFR 393.75(b) (4/32 in)
    expect(all).toMatch(/steer tire tread depth: \d+\/32 in \(limit 4\/32 in\) · 49 CFR 393\.75/);
    expect(all).toMatch(/governor cut-?out: \d+ psi/i);
    expect(all).not.toContain('No reading was taken');
  });

  it('prints the drawn signature as an image, and none when no signature was drawn', async () => {
    const before = await read((await renderReportPdf({ fleetId: f.fleet.id, id: reportId })).pdf);
    expect(before.raw).not.toMatch(/\/Subtype \/Image/);
    const png = await sharp({ create: { width: 300, height: 90, channels: 3, background: '#ffffff' } })
      .composite([
        {
          input: Buffer.from(
            '<svg width="300" height="90"><path d="M10 60 C 60 10, 90 90, 290 30" stroke="black" stroke-width="4" fill="none"/></svg>',
          ),
        },
      ])
      .png()
      .toBuffer();
    const key = `fleet/${f.fleet.id}/inspections/${reportId}/signature.png`;
    await putObject(key, png, 'image/png');
    await f.db.updateTable('inspection').set({ signatureKey: key }).where('id', '=', reportId).execute();
    const after = await read((await renderReportPdf({ fleetId: f.fleet.id, id: reportId })).pdf);
    expect(after.raw).toMatch(/\/Subtype \/Image/);
    expect(after.raw).toMatch(/\/Width 300/);
    expect(after.pages.join(' ')).toContain('Drawn signature:');
  });
});
