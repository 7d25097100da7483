import 'server-only';
import { tidyText } from '@/lib/walk/name-finding';
import { renderUnitMail, type MailDefect, type RenderedMail } from './render-mail';

/** The last open major defect of a unit was certified: the unit is back in service. */
export function renderBackInServiceMail({
  fleetName,
  unitNumber,
  defects,
  certifiedName,
  certifiedAt,
  defectUrl,
}: {
  fleetName: string;
  unitNumber: string;
  defects: readonly MailDefect[];
  certifiedName: string;
  certifiedAt: string;
  defectUrl: string;
}): RenderedMail {
  const subject = `Back in service: unit ${unitNumber} (${fleetName})`;
  const lead = `Unit ${unitNumber} is back in service: no major defect is open. Last certification by ${certifiedName} at ${certifiedAt}. The next driver reviews and signs the last report before driving (49 CFR 396.13).`;
  const items = defects.map(
    (d) =>
      `${d.outcome === 'no_repair_needed' ? 'no repair needed' : 'repaired'}: ${tidyText(d.description)}${d.certifiedName ? ` (certified by ${d.certifiedName})` : ''}`,
  );
  return renderUnitMail({
    subject,
    lead,
    items,
    link: { href: defectUrl, label: 'Open the certification', textLabel: 'Certification' },
    band: 'BACK IN SERVICE',
    bandColour: '#16703e',
    heading: `Unit ${unitNumber} may be driven again`,
  });
}
