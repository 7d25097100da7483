import 'server-only';
import { countWords, tidyText } from '@/lib/walk/name-finding';
import { renderUnitMail, severityWords, type MailDefect, type RenderedMail } from './render-mail';

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
  const majors = defects.filter((d) => d.severity === 'major').length || 1;
  const lead = `Unit ${unitNumber} is out of service: ${majors === 1 ? 'a major defect was' : `${countWords(majors, 'major defect')} were`} reported${driverName ? ` by ${driverName}` : ''}. It must not be driven until the repair is certified.`;
  const items = defects.map(
    (d) =>
      `${severityWords(d.severity)}: ${tidyText(d.description)}${d.unitNumber && d.unitNumber !== unitNumber ? ` (unit ${d.unitNumber})` : ''}`,
  );
  return renderUnitMail({
    subject,
    lead,
    items,
    link: { href: inspectionUrl, label: 'Open the report', textLabel: 'Report' },
    band: 'OUT OF SERVICE',
    bandColour: '#b21828',
    heading: `Unit ${unitNumber} — do not drive`,
  });
}
