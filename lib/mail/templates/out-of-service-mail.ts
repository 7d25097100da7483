import 'server-only';
import { htmlLayout, safetyFooter, severityWords, type MailDefect, type RenderedMail } from './render-mail';

/** A unit was put out of service by a major defect: to maintenance and the supervisor. */
export function renderOutOfServiceMail({
  fleetName,
  unitNumber,
  defects,
  inspectionUrl,
  driverName,
}: {
  fleetName: string;
  unitNumber: string;
  defects: readonly MailDefect[];
  inspectionUrl: string;
  driverName?: string;
}): RenderedMail {
  const subject = `OUT OF SERVICE: unit ${unitNumber} (${fleetName})`;
  const lead = `Unit ${unitNumber} is out of service: ${defects.filter((d) => d.severity === 'major').length || 'a'} major defect(s) were reported${driverName ? ` by ${driverName}` : ''}. It must not be driven until the repair is certified.`;
  const items = defects.map(
    (d) =>
      `${severityWords(d.severity)}: ${d.description}${d.unitNumber && d.unitNumber !== unitNumber ? ` (unit ${d.unitNumber})` : ''}`,
  );
  const text = [
    subject,
    '',
    lead,
    '',
    ...items.map((i) => `- ${i}`),
    '',
    `Report: ${inspectionUrl}`,
    '',
    safetyFooter,
    '',
  ].join('\n');
  const html = htmlLayout({
    band: 'OUT OF SERVICE',
    bandColour: '#b21828',
    heading: `Unit ${unitNumber} — do not drive`,
    paragraphs: [lead],
    items,
    link: { href: inspectionUrl, label: 'Open the report' },
  });
  return { subject, text, html };
}
