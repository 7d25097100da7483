// Every text RigCall renders from seeded history (the transcript, the mechanic's queue, the mails,
// the CSV export and the PDF) says each word once and shows no raw id or unit code.
import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { extractText, getDocumentProxy } from 'unpdf';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DefectQueue } from '@/app/(mechanic)/mechanic/defect-queue';
import { Transcript } from '@/app/(supervisor)/supervisor/reports/[id]/transcript';
import { renderBackInServiceMail, renderOutOfServiceMail, renderRepairNeededMail } from '@/lib/mail/templates';
import { listDefectQueue } from '@/lib/services/defects/list-defect-queue';
import { exportReportsCsv } from '@/lib/services/reports/export-reports-csv';
import { getReportDetail } from '@/lib/services/reports/get-report-detail';
import { renderReportPdf } from '@/lib/services/reports/render-report-pdf';
import { exportReportsQuerySchema } from '@/lib/schemas/reports';
import { rawIdPattern } from '@/lib/walk/name-finding';
import { makeOfficeFleet, type OfficeFleet } from './office-fixtures';

let f: OfficeFleet;
let reportIds: string[];
beforeAll(async () => {
  f = await makeOfficeFleet({ history: 30, name: 'Words fleet' });
  // Reports with a failed reading and reports with a spoken finding, a few of each.
  const rows = await f.db
    .selectFrom('defect as df')
    .innerJoin('inspectionStep as s', 's.id', 'df.stepId')
    .select(['df.inspectionId', 's.kind'])
    .where('df.fleetId', '=', f.fleet.id)
    .orderBy('df.createdAt', 'desc')
    .execute();
  const pick = (kind: string) =>
    [...new Set(rows.filter((r) => r.kind === kind).map((r) => r.inspectionId))].slice(0, 4);
  reportIds = [...pick('measurement'), ...pick('defect')];
}, 120_000);
afterAll(() => f.db.destroy());

const htmlText = (markup: string) =>
  markup
    .replace(/<[^>]+>/g, ' ')
    .replace(/&#x27;|&#39;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ');

/** Two words in a row that are the same word, punctuation aside ("tire, tire"); numbers may repeat. */
function repeatedWords(text: string): string[] {
  const found: string[] = [];
  const tokens = text.split(/\s+/).filter(Boolean);
  const word = (t: string) =>
    /^[\p{L}][\p{L}'-]*[,:;.]?$/u.test(t) ? t.toLowerCase().replace(/[^\p{L}'-]/gu, '') : null;
  for (let i = 1; i < tokens.length; i++) {
    const a = word(tokens[i - 1]!);
    if (a && a === word(tokens[i]!)) found.push(tokens.slice(Math.max(0, i - 4), i + 3).join(' '));
  }
  // two-word and three-word runs said twice ("rear impact guard rear impact guard")
  for (const n of [2, 3])
    for (let i = 0; i + 2 * n <= tokens.length; i++) {
      const run = tokens.slice(i, i + 2 * n).map(word);
      if (run.every(Boolean) && run.slice(0, n).every((w, j) => w === run[n + j]))
        found.push(tokens.slice(i, i + 2 * n).join(' '));
    }
  return found;
}

function expectReadable(where: string, text: string) {
  expect(text.length, `${where}: some text`).toBeGreaterThan(20);
  expect(repeatedWords(text), `${where}: a word said twice in a row`).toEqual([]);
  expect(text.match(new RegExp(rawIdPattern.source, 'g')) ?? [], `${where}: a raw id or unit code`).toEqual([]);
  expect(text, `${where}: "(s)" instead of a plural`).not.toMatch(/\w\(s\)/);
}

describe('rendered words from seeded history', () => {
  it('the seeded history has failed readings and spoken findings to show', () => {
    expect(reportIds.length).toBeGreaterThanOrEqual(4);
  });

  it('the transcript of each report', async () => {
    for (const id of reportIds) {
      const report = await getReportDetail({ fleetId: f.fleet.id, id, withPhotoUrls: false });
      expectReadable(`transcript ${id}`, htmlText(renderToStaticMarkup(createElement(Transcript, { report }))));
    }
  });

  it("the mechanic's queue, open and certified", async () => {
    for (const status of ['open', 'closed'] as const) {
      const { groups } = await listDefectQueue({ fleetId: f.fleet.id, query: { status } });
      const markup = renderToStaticMarkup(
        createElement(DefectQueue, { groups, status, filteredUnit: null, timeZone: 'America/Chicago' }),
      );
      expectReadable(`queue ${status}`, htmlText(markup));
    }
  });

  it('the mails about a unit, from its stored defects', async () => {
    const defects = await f.db
      .selectFrom('defect as df')
      .innerJoin('unit as u', 'u.id', 'df.unitId')
      .select(['df.severity', 'df.description', 'u.unitNumber', 'df.certifiedName', 'df.status'])
      .where('df.fleetId', '=', f.fleet.id)
      .execute();
    expect(defects.length).toBeGreaterThan(3);
    const base = {
      fleetName: f.fleet.name,
      unitNumber: defects[0]!.unitNumber,
      inspectionUrl: 'https://rigcall.test/r',
    };
    for (const mail of [
      renderOutOfServiceMail({ ...base, defects, driverName: 'Avery Stone' }),
      renderOutOfServiceMail({ ...base, defects: defects.filter((d) => d.severity === 'major').slice(0, 1) }),
      renderRepairNeededMail({ ...base, defects, requestedBy: 'Sam Lead' }),
      renderRepairNeededMail({ ...base, defects: defects.slice(0, 1) }),
      renderBackInServiceMail({
        ...base,
        defects: defects.map((d) => ({ ...d, outcome: d.status })),
        certifiedName: 'Morgan Shop',
        certifiedAt: '2 Dec 2026, 08:00',
        defectUrl: 'https://rigcall.test/d',
      }),
    ]) {
      expectReadable(`mail "${mail.subject}"`, mail.text);
      expectReadable(`mail "${mail.subject}" html`, htmlText(mail.html));
    }
  });

  it('the CSV export, every cell under its header', async () => {
    const text = await new Response(
      exportReportsCsv({ fleetId: f.fleet.id, query: exportReportsQuerySchema.parse({}) }),
    ).text();
    const [, ...lines] = text.split('\r\n');
    expect(lines.length).toBeGreaterThan(10);
    expectReadable('csv', lines.join(' ').replace(/,/g, ' , '));
  });

  it('the PDF of each report', async () => {
    for (const id of reportIds) {
      const { pdf } = await renderReportPdf({ fleetId: f.fleet.id, id });
      const { text } = await extractText(await getDocumentProxy(new Uint8Array(pdf)), { mergePages: true });
      expectReadable(`pdf ${id}`, text.replace(/\s+/g, ' '));
    }
  });
});
