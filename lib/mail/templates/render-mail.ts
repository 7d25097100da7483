import 'server-only';

export type RenderedMail = { subject: string; text: string; html: string };

export type MailDefect = {
  severity: 'minor' | 'major';
  description: string;
  unitNumber?: string;
  certifiedName?: string | null;
  /** 'repaired', 'no_repair_needed' or 'open' as stored; another value reads as repaired. */
  outcome?: string;
};

export const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export const severityWords = (s: 'minor' | 'major') => (s === 'major' ? 'MAJOR (out of service)' : 'minor');

export const safetyFooter =
  "Before anyone works on the unit: chock the wheels, set the spring brakes, engine off and key out, never go under a unit held up only by air suspension, and treat air tanks and lines as pressurised. Local regulations and the carrier's licensed maintenance practice decide what may be driven.";

/** A plain, table-free HTML body: a heading band, paragraphs, a list, a link; readable in any client. */
function htmlLayout({
  band,
  bandColour,
  heading,
  paragraphs,
  items,
  link,
}: {
  band: string;
  bandColour: string;
  heading: string;
  paragraphs: string[];
  items: string[];
  link?: { href: string; label: string };
}): string {
  return [
    '<!doctype html><html><body style="margin:0;padding:0;background:#f2efe6;font-family:Arial,Helvetica,sans-serif;color:#14161a">',
    `<div style="background:${bandColour};color:#ffffff;padding:12px 20px;font-weight:bold;letter-spacing:0.05em">${escapeHtml(band)}</div>`,
    '<div style="padding:20px;max-width:640px">',
    `<h1 style="font-size:22px;margin:0 0 12px">${escapeHtml(heading)}</h1>`,
    ...paragraphs.map((p) => `<p style="font-size:16px;line-height:1.45;margin:0 0 12px">${escapeHtml(p)}</p>`),
    items.length
      ? `<ul style="font-size:16px;line-height:1.45">${items.map((i) => `<li>${escapeHtml(i)}</li>`).join('')}</ul>`
      : '',
    link
      ? `<p style="margin:16px 0"><a href="${escapeHtml(link.href)}" style="background:#c6f432;color:#14161a;padding:10px 16px;border:3px solid #14161a;border-radius:8px;text-decoration:none;font-weight:bold">${escapeHtml(link.label)}</a></p>`
      : '',
    `<p style="font-size:13px;color:#4a4e56;margin-top:24px">${escapeHtml(safetyFooter)}</p>`,
    '</div></body></html>',
  ].join('');
}

/**
 * A unit mail in both bodies: the subject, one lead paragraph, the defects as a list, one link
 * (named in the text body by `link.textLabel`), and the safety footer.
 */
export function renderUnitMail({
  subject,
  lead,
  items,
  link,
  band,
  bandColour,
  heading,
}: {
  subject: string;
  lead: string;
  items: string[];
  link: { href: string; label: string; textLabel: string };
  band: string;
  bandColour: string;
  heading: string;
}): RenderedMail {
  const text = [
    subject,
    '',
    lead,
    '',
    ...items.map((i) => `- ${i}`),
    '',
    `${link.textLabel}: ${link.href}`,
    '',
    safetyFooter,
    '',
  ].join('\n');
  const html = htmlLayout({ band, bandColour, heading, paragraphs: [lead], items, link });
  return { subject, text, html };
}
