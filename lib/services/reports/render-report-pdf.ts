import 'server-only';
import { createRequire } from 'node:module';
import path from 'node:path';
import type PDFKit from 'pdfkit';
import type { ReportDetail } from '@/lib/schemas/reports';
import {
  formatLimitText,
  formatQuantity,
  idWords,
  nameFinding,
  nameReading,
  nounFor,
  sourceWords,
  tidyText,
} from '@/lib/walk/name-finding';
import { getDb } from '@/lib/db';
import { getObjectBytes } from '@/lib/storage';
import { getReportDetail } from './get-report-detail';

// pdfkit reads its font metrics from files beside its own code, so it is loaded at run time from
// node_modules rather than bundled.
const loadPdfKit = (): typeof PDFKit =>
  createRequire(path.join(process.cwd(), 'package.json'))(['pdf', 'kit'].join('')) as typeof PDFKit;

const when = (isoText: string | null, tz: string) =>
  isoText
    ? `${new Intl.DateTimeFormat('en-US', { timeZone: tz, dateStyle: 'medium', timeStyle: 'short', hourCycle: 'h23' }).format(new Date(isoText))} (${tz})`
    : '—';

const kindWords = (k: string) => (k === 'post_trip' ? 'Post-trip' : 'Pre-trip');

/** The printable record of one report: everything 49 CFR 396.11(a)(2)–(3) asks, and the next driver's review (396.13). */
/** Images printed with the report: the drawn signature and the photos, by attachment id (PNG or JPEG). */
export type ReportPdfImages = { signature: Buffer | null; photos: ReadonlyMap<string, Buffer> };

const noImages: ReportPdfImages = { signature: null, photos: new Map() };

export function renderReportPdfFromDetail(r: ReportDetail, images: ReportPdfImages = noImages): Promise<Buffer> {
  const PDFDocument = loadPdfKit();
  const doc = new PDFDocument({
    size: 'LETTER',
    margins: { top: 48, bottom: 48, left: 54, right: 54 },
    bufferPages: true,
    info: { Title: `Inspection report ${r.tractor.number} ${r.startedAt.slice(0, 10)}`, Author: r.fleetName },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const tz = r.timezone;
  const width = doc.page.width - 108;
  const heading = (t: string) => {
    doc
      .moveDown(0.8)
      .font('Helvetica-Bold')
      .fontSize(12)
      .fillColor('#14161a')
      .text(t.toUpperCase(), { characterSpacing: 0.5 });
    doc
      .moveTo(54, doc.y + 2)
      .lineTo(54 + width, doc.y + 2)
      .lineWidth(1.5)
      .stroke('#14161a')
      .moveDown(0.4);
    doc.font('Helvetica').fontSize(10);
  };
  const field = (label: string, value: string) => {
    doc.font('Helvetica-Bold').fontSize(10).text(`${label}: `, { continued: true }).font('Helvetica').text(value);
  };

  doc
    .font('Helvetica-Bold')
    .fontSize(18)
    .text(`${kindWords(r.kind)} inspection report`);
  doc.font('Helvetica').fontSize(11).text(`${r.fleetName} · driver vehicle inspection report (49 CFR 396.11)`);
  const majorOpen = r.defects.some((d) => d.severity === 'major' && d.status === 'open');
  if (majorOpen) {
    doc.moveDown(0.4).rect(54, doc.y, width, 22).fill('#b21828');
    doc
      .fillColor('#ffffff')
      .font('Helvetica-Bold')
      .fontSize(12)
      .text('OUT OF SERVICE: a major defect has no repair certification', 62, doc.y + 6);
    doc.fillColor('#14161a').moveDown(0.6);
    doc.x = 54;
  }

  heading('Vehicle');
  field(
    'Tractor',
    `unit ${r.tractor.number}${r.tractor.plate ? `, plate ${r.tractor.plate}${r.tractor.plateJurisdiction ? ` (${r.tractor.plateJurisdiction})` : ''}` : ''}${r.tractor.vin ? `, VIN ${r.tractor.vin}` : ''}${r.tractor.make ? `, ${r.tractor.make} ${r.tractor.model ?? ''}`.trimEnd() : ''}`,
  );
  field(
    'Trailer',
    r.trailer
      ? `unit ${r.trailer.number}${r.trailer.plate ? `, plate ${r.trailer.plate}${r.trailer.plateJurisdiction ? ` (${r.trailer.plateJurisdiction})` : ''}` : ''}${r.trailer.make ? `, ${r.trailer.make} ${r.trailer.model ?? ''}`.trimEnd() : ''}`
      : 'none (bobtail)',
  );
  field('Odometer', r.odometer === null ? '—' : `${r.odometer.toLocaleString('en-US')} mi`);
  field('Location', r.location ?? '—');
  if (r.billOfLading || r.sealNumber)
    field('Load', `bill of lading ${r.billOfLading ?? '—'}, seal ${r.sealNumber ?? '—'}`);

  heading('Date and time');
  field('Started', when(r.startedAt, tz));
  field('Finished', when(r.finishedAt, tz));
  field(
    'Duration',
    r.duration
      ? `${r.duration.minutes.toFixed(1)} min (fleet minimum ${r.duration.minimumMinutes} min${r.duration.short ? ', SHORTER THAN THE MINIMUM' : ''})`
      : '—',
  );
  field('Rule profile', r.ruleProfile);
  field('Zones walked', r.zones.map((z) => z.name).join(', ') || '—');
  if (r.skippedZones.length) field('Zones not walked', r.skippedZones.map((z) => z.name).join(', '));

  const named = (d: ReportDetail['defects'][number]) =>
    nameFinding({ component: d.component, condition: d.condition, position: d.position });
  heading('Defects found or reported');
  if (!r.defects.length) doc.text('No defect found or reported.');
  for (const [i, d] of r.defects.entries()) {
    doc
      .font('Helvetica-Bold')
      .text(
        `${i + 1}. ${d.severity === 'major' ? (d.status === 'open' ? 'MAJOR (out of service)' : 'Major') : 'Minor'} · unit ${d.unitNumber} · ${tidyText(d.description)}`,
      );
    doc
      .font('Helvetica')
      .text(`Found in the ${idWords(d.zone)} zone${named(d) === tidyText(d.description) ? '' : `: ${named(d)}`}.`, {
        indent: 14,
      });
    const step = r.zones.flatMap((z) => z.steps).find((s) => s.id === d.stepId);
    if (step?.measurementKind)
      doc.text(
        `Measured ${formatQuantity(step.value, step.unit)}; limit ${formatLimitText(step.limitText)}; source ${sourceWords(step.source)}.`,
        { indent: 14 },
      );
    const shots = (step?.photos ?? []).filter((p) => images.photos.has(p.id));
    if (shots.length) {
      doc.text(`Driver's ${nounFor(shots.length, 'photo')}:`, { indent: 14 });
      const top = doc.y + 2;
      shots.slice(0, 4).forEach((p, k) => {
        doc.image(images.photos.get(p.id)!, 68 + k * 104, top, { fit: [96, 72] });
      });
      doc.y = top + 76;
      doc.x = 54;
    }
    if (d.status === 'open') {
      doc
        .font('Helvetica-Bold')
        .text('Repair certification: NONE YET. The unit must not be driven on this defect until it is certified.', {
          indent: 14,
        });
    } else {
      doc
        .font('Helvetica-Bold')
        .text(
          `Repair certification: ${d.status === 'repaired' ? 'repaired' : 'repair unnecessary'}, by ${d.certifiedName ?? '—'} at ${when(d.certifiedAt, tz)}.`,
          { indent: 14 },
        );
      doc.font('Helvetica');
      if (d.repairWork) doc.text(`Work: ${d.repairWork}`, { indent: 14 });
      if (d.repairParts) doc.text(`Parts: ${d.repairParts}`, { indent: 14 });
      if (d.repairNotes) doc.text(`Notes: ${d.repairNotes}`, { indent: 14 });
      if (d.certificationText) doc.text(`Statement: "${d.certificationText}"`, { indent: 14 });
    }
    doc.font('Helvetica').moveDown(0.3);
  }

  heading('Readings within their limits');
  const passing = r.zones.flatMap((z) => z.steps.filter((st) => st.kind === 'measurement' && st.verdict === 'pass'));
  if (!passing.length) doc.text('No reading was taken, or none passed.');
  for (const st of passing)
    doc.text(
      `${nameReading({ component: st.component, check: st.measurementKind, value: st.value, unit: st.unit, limitText: st.limitText })} · ${sourceWords(st.source)}`,
    );

  heading("Driver's certification and signature");
  field('Driver', r.driverName);
  field('Statement', r.certificationText ?? '—');
  field('Signed', r.signatureName ? `${r.signatureName}, ${when(r.signedAt, tz)}` : 'NOT SIGNED');
  if (images.signature) {
    doc.font('Helvetica-Bold').text('Drawn signature:');
    const top = doc.y + 2;
    doc.image(images.signature, 54, top, { fit: [220, 70] });
    doc.rect(54, top, 220, 70).lineWidth(0.5).stroke('#8a8f98');
    doc.y = top + 76;
    doc.x = 54;
    doc.font('Helvetica');
  }

  heading("Next driver's review (49 CFR 396.13)");
  if (!r.acknowledgements.length)
    doc.text(
      r.defects.length ? 'Not yet reviewed by the next driver.' : 'No defect listed: no review signature needed.',
    );
  for (const a of r.acknowledgements)
    doc.text(
      `Reviewed and signed by ${a.signatureName} for unit ${a.unitNumber}, ${when(a.acknowledgedAt, tz)}: "${a.statement}"`,
    );

  heading('Office review');
  doc.text(
    r.review.reviewedAt
      ? `Reviewed by ${r.review.reviewerName ?? '—'} at ${when(r.review.reviewedAt, tz)}${r.review.note ? `: ${r.review.note}` : '.'}`
      : 'Not reviewed yet.',
  );

  heading('Record integrity');
  doc.fontSize(9).text(`Report ${r.id}. Vocabulary ${r.vocabulary.label ?? '—'}.`);
  doc.text(
    `Content hash (sha-256): ${r.hash.stored ?? '—'} — ${r.hash.state === 'match' ? 'matches the stored rows' : r.hash.state === 'mismatch' ? 'DOES NOT MATCH the stored rows' : 'not signed'}.`,
  );
  doc.text(
    `Printed ${when(new Date().toISOString(), tz)}. Keep this report, its repair certifications and the next driver's review for at least three months (49 CFR 396.11).`,
  );
  // Page numbers, "n of N", on every page once the length is known.
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc
      .font('Helvetica')
      .fontSize(9)
      .fillColor('#4a4e56')
      .text(`Page ${i - range.start + 1} of ${range.count}`, 54, doc.page.height - 34, { width, align: 'right' });
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return done;
}

const printable = (bytes: Uint8Array): Buffer | null => {
  const b = Buffer.from(bytes);
  const png = b.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  const jpeg = b[0] === 0xff && b[1] === 0xd8;
  return png || jpeg ? b : null;
};

/** The signature and the finding photos from storage; one that cannot be read is left out, never guessed. */
async function loadImages(fleetId: string, detail: ReportDetail): Promise<ReportPdfImages> {
  const row = await getDb()
    .selectFrom('inspection')
    .select('signatureKey')
    .where('fleetId', '=', fleetId)
    .where('id', '=', detail.id)
    .executeTakeFirst();
  const read = async (key: string) => {
    try {
      return printable((await getObjectBytes(key)).bytes);
    } catch {
      return null;
    }
  };
  const photos = new Map<string, Buffer>();
  const defectSteps = new Set(detail.defects.map((d) => d.stepId));
  for (const st of detail.zones.flatMap((z) => z.steps).filter((x) => defectSteps.has(x.id)))
    for (const p of st.photos.slice(0, 4)) {
      const bytes = await read(p.objectKey);
      if (bytes) photos.set(p.id, bytes);
    }
  return { signature: row?.signatureKey ? await read(row.signatureKey) : null, photos };
}

export async function renderReportPdf({ fleetId, id }: { fleetId: string; id: string }) {
  const detail = await getReportDetail({ fleetId, id, withPhotoUrls: false });
  return {
    pdf: await renderReportPdfFromDetail(detail, await loadImages(fleetId, detail)),
    fileName: `report-${detail.tractor.number}-${detail.startedAt.slice(0, 10)}-${detail.id.slice(0, 8)}.pdf`,
  };
}
