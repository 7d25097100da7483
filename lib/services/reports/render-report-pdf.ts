import 'server-only';
import { createRequire } from 'node:module';
import path from 'node:path';
import type PDFKit from 'pdfkit';
import type { ReportDetail } from '@/lib/schemas/reports';
import { formatLimitText, formatQuantity, idWords, nameFinding, sourceWords, tidyText } from '@/lib/walk/name-finding';
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
export function renderReportPdfFromDetail(r: ReportDetail): Promise<Buffer> {
  const PDFDocument = loadPdfKit();
  const doc = new PDFDocument({
    size: 'LETTER',
    margins: { top: 48, bottom: 48, left: 54, right: 54 },
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

  heading("Driver's certification and signature");
  field('Driver', r.driverName);
  field('Statement', r.certificationText ?? '—');
  field('Signed', r.signatureName ? `${r.signatureName}, ${when(r.signedAt, tz)}` : 'NOT SIGNED');

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
  doc.end();
  return done;
}

export async function renderReportPdf({ fleetId, id }: { fleetId: string; id: string }) {
  const detail = await getReportDetail({ fleetId, id, withPhotoUrls: false });
  return {
    pdf: await renderReportPdfFromDetail(detail),
    fileName: `report-${detail.tractor.number}-${detail.startedAt.slice(0, 10)}-${detail.id.slice(0, 8)}.pdf`,
  };
}
