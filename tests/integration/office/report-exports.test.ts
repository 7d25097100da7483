// Exports for audits: the printable PDF holds what 49 CFR 396.11(a)(2)–(3) asks (unit, date and
// time, driver and signature, defects, repair certification) and the next driver's review
// (396.13), read back with a PDF text extractor; the CSV has its columns and safe cells.
import { extractText, getDocumentProxy } from 'unpdf';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as exportRoute from '@/app/api/reports/export/route';
import * as pdfRoute from '@/app/api/reports/[id]/pdf/route';
import { escapeCsvCell, reportCsvColumns } from '@/lib/services/reports/export-reports-csv';
import { certifyRepair } from '@/lib/services/defects/certify-repair';
import { callRoute, makeRequest } from '../../setup/session';
import { makeOfficeFleet, makeSignedReport, type OfficeFleet } from './office-fixtures';

let f: OfficeFleet;
beforeAll(async () => {
  f = await makeOfficeFleet({ name: 'Export fleet' });
});
afterAll(() => f.db.destroy());

async function pdfText(res: Response): Promise<string> {
  const pdf = await getDocumentProxy(new Uint8Array(await res.arrayBuffer()));
  const { text } = await extractText(pdf, { mergePages: true });
  return text.replace(/\s+/g, ' ');
}

describe('GET /api/reports/[id]/pdf', () => {
  it('prints unit, date and time, driver and signature, defects, repair certification and the next driver review', async () => {
    const report = await makeSignedReport(f, {
      startedAt: new Date('2026-11-20T12:05:00Z'),
      location: 'North yard, door 4',
      defects: [
        { unit: 'tractor', severity: 'major', description: 'steer tire, bulge, left' },
        { unit: 'trailer', severity: 'minor', description: 'clearance lamp, inoperative' },
      ],
    });
    await certifyRepair({
      fleetId: f.fleet.id,
      actorId: f.mechanic.id,
      actorName: f.mechanic.name,
      id: report.defects[0]!.id,
      body: {
        outcome: 'repaired',
        work: 'Replaced left steer tire',
        parts: 'steer tire 295/75R22.5',
        notes: '',
        certifiedName: 'Morgan Shop',
        confirm: true,
      },
    });
    await f.db
      .insertInto('acknowledgement')
      .values({
        fleetId: f.fleet.id,
        unitId: report.tractor.id,
        reviewedInspectionId: report.id,
        driverId: f.drivers[1]!.id,
        signatureName: 'Blake Ortiz',
        statement: 'I reviewed the last report and its repair certification.',
      })
      .execute();

    const res = await callRoute(
      pdfRoute.GET,
      makeRequest(`/api/reports/${report.id}/pdf`, { cookie: f.cookies.supervisor }),
      { id: report.id },
    );
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const text = await pdfText(res);

    // 396.11(a)(2): identifies the vehicle
    expect(text).toContain(`unit ${report.tractor.unitNumber}, plate P-101`);
    expect(text).toContain(`unit ${report.trailer!.unitNumber}`);
    // date and time of the inspection (fleet time zone)
    expect(text).toMatch(/Started: Nov 20, 2026, 06:05 \(America\/Chicago\)/);
    expect(text).toContain('North yard, door 4');
    // every defect found or reported, with its severity
    // Certified: major, no longer out of service.
    expect(text).toContain('Major · unit 101 · steer tire, bulge, left');
    expect(text).toContain('Minor · unit 5001 · clearance lamp, inoperative');
    // the driver's signature
    expect(text).toContain('Driver: Avery Stone');
    expect(text).toMatch(/Signed: Avery Stone, Nov 20, 2026/);
    expect(text).toContain('I performed this inspection and the report lists every defect');
    // 396.11(a)(3): the carrier certifies repaired or repair unnecessary; the open one says so
    expect(text).toMatch(/Repair certification: repaired, by Morgan Shop at/);
    expect(text).toContain('Work: Replaced left steer tire');
    expect(text).toContain('Repair certification: NONE YET');
    // 396.13: the next driver's review signature
    expect(text).toMatch(/Reviewed and signed by Blake Ortiz for unit 101/);
    // integrity
    expect(text).toContain(report.hash);
    expect(text).toContain('matches the stored rows');
  });

  it('says plainly when no defect was listed and that no review signature is needed', async () => {
    const report = await makeSignedReport(f, { tractorIndex: 1, trailerIndex: null });
    const text = await pdfText(
      await callRoute(pdfRoute.GET, makeRequest(`/api/reports/${report.id}/pdf`, { cookie: f.cookies.mechanic }), {
        id: report.id,
      }),
    );
    expect(text).toContain('No defect found or reported.');
    expect(text).toContain('Trailer: none (bobtail)');
    expect(text).toContain('No defect listed: no review signature needed.');
  });

  it("is 404 for another fleet's report", async () => {
    const other = await makeOfficeFleet({ name: 'Other export fleet' });
    const theirs = await makeSignedReport(other);
    const res = await callRoute(
      pdfRoute.GET,
      makeRequest(`/api/reports/${theirs.id}/pdf`, { cookie: f.cookies.supervisor }),
      { id: theirs.id },
    );
    expect(res.status).toBe(404);
  });
});

/** A small RFC 4180 reader, to read the export back the way a spreadsheet does. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (c === '"') quoted = false;
      else cell += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      row.push(cell);
      cell = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
      i++;
    } else cell += c;
  }
  if (cell || row.length) {
    row.push(cell);
    rows.push(row);
  }
  return rows;
}

describe('CSV export', () => {
  it('escapes quotes, commas and line breaks, and guards cells a spreadsheet would run as formulas', () => {
    expect(escapeCsvCell('plain')).toBe('plain');
    expect(escapeCsvCell('Yard 4, bay "B"')).toBe('"Yard 4, bay ""B"""');
    expect(escapeCsvCell('line one\nline two')).toBe('"line one\nline two"');
    expect(escapeCsvCell('=HYPERLINK("http://x.example","go")')).toBe(`"'=HYPERLINK(""http://x.example"",""go"")"`);
    expect(escapeCsvCell('+15551234')).toBe("'+15551234");
    expect(escapeCsvCell('-2+3')).toBe("'-2+3");
    expect(escapeCsvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(escapeCsvCell('\tcmd')).toBe("'\tcmd");
    expect(escapeCsvCell('2026-11-20T12:05:00.000Z')).toBe('2026-11-20T12:05:00.000Z');
  });

  it('exports the filtered table with its columns, one line a report, values safe to open', async () => {
    const g = await makeOfficeFleet({ name: 'CSV fleet' });
    const nasty = ['=cmd|" /C calc"!A0', 'Dock 7, "north", gate\nlane 2', '@risk', '-1 lane', '+east'];
    const made = [];
    for (const [i, location] of nasty.entries())
      made.push(
        await makeSignedReport(g, {
          location,
          startedAt: new Date(Date.now() - (i + 1) * 3600_000),
          defects: i === 0 ? [{ unit: 'tractor', severity: 'major', description: 'x' }] : [],
        }),
      );
    await makeSignedReport(g, { kind: 'post_trip', startedAt: new Date(Date.now() - 10 * 3600_000) });

    const res = await callRoute(
      exportRoute.GET,
      makeRequest('/api/reports/export?kind=pre_trip&sort=startedAt&dir=desc', { cookie: g.cookies.supervisor }),
    );
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(res.headers.get('content-disposition')).toMatch(
      /attachment; filename="inspection-reports-\d{4}-\d{2}-\d{2}\.csv"/,
    );
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]); // a UTF-8 mark, so spreadsheets read names right
    const rows = parseCsv(new TextDecoder().decode(bytes));
    expect(rows[0]).toEqual(reportCsvColumns.map(([name]) => name));
    expect(rows[0]).toEqual([
      'report_id',
      'type',
      'status',
      'started_at',
      'finished_at',
      'duration_min',
      'minimum_min',
      'short',
      'driver',
      'tractor',
      'trailer',
      'odometer',
      'location',
      'major_defects',
      'minor_defects',
      'open_defects',
      'reviewed_at',
    ]);
    expect(rows).toHaveLength(1 + nasty.length); // the post-trip is filtered out
    const col = (name: string) => rows[0]!.indexOf(name);
    expect(rows.slice(1).map((r) => r[col('report_id')])).toEqual(made.map((m) => m.id));
    expect(rows.slice(1).map((r) => r[col('location')])).toEqual([
      `'=cmd|" /C calc"!A0`,
      'Dock 7, "north", gate\nlane 2',
      "'@risk",
      "'-1 lane",
      "'+east",
    ]);
    expect(rows[1]![col('major_defects')]).toBe('1');
    expect(rows[1]![col('open_defects')]).toBe('1');
    expect(rows[1]![col('type')]).toBe('pre-trip');
    expect(rows[1]![col('duration_min')]).toBe('20.0');
    expect(rows[1]![col('driver')]).toBe('Avery Stone');
    // ISO 8601 in the fleet's zone with its offset (the fixture fleet is in America/Chicago).
    expect(rows[1]![col('started_at')]).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}-0[56]:00$/);
    // the same instant as written, an hour before the test ran
    expect(Math.abs(new Date(rows[1]![col('started_at')]!).getTime() - (Date.now() - 3600_000))).toBeLessThan(600_000);
    expect(rows.every((r) => r.length === rows[0]!.length)).toBe(true);
  });
});
