import 'server-only';
import { countWords, tidyText } from '@/lib/walk/name-finding';
import { renderUnitMail, severityWords, type MailDefect, type RenderedMail } from './render-mail';

/** Open defects that still need the shop (minor ones too: repair before the next inspection is due). */
export function renderRepairNeededMail({
  fleetName,
  unitNumber,
  defects,
  inspectionUrl,
  requestedBy,
}: {
  fleetName: string;
  unitNumber: string;
  defects: readonly MailDefect[];
  inspectionUrl: string;
  requestedBy?: string;
}): RenderedMail {
  const subject = `Repair needed: unit ${unitNumber} (${fleetName})`;
  const lead = `Unit ${unitNumber} has ${countWords(defects.length, 'open defect')} waiting for a repair and its certification${requestedBy ? ` (sent by ${requestedBy})` : ''}.`;
  const items = defects.map((d) => `${severityWords(d.severity)}: ${tidyText(d.description)}`);
  return renderUnitMail({
    subject,
    lead,
    items,
    link: { href: inspectionUrl, label: 'Open the report', textLabel: 'Report' },
    band: 'REPAIR NEEDED',
    bandColour: '#965800',
    heading: `Unit ${unitNumber}: open defects`,
  });
}
