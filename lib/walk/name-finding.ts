// How a finding, a reading, a limit's source or a status is named on screen, in mail, CSV and PDF.
// Pure: used by the phone, the office screens and the server alike.

const words = (s: string) => s.trim().split(/\s+/).filter(Boolean);

/** The words of an id: "steer_tire" → "steer tire"; a term key "steer_tire:bulge" → "steer tire, bulge". */
export function idWords(id: string): string {
  return id
    .split(':')
    .map((p) => p.replace(/[_.]+/g, ' ').trim())
    .filter(Boolean)
    .join(', ');
}

/** Text as given, or the words of it when it is an id ("steer_tire" → "steer tire"). */
const plain = (s: string | null | undefined) => (s ? (/[_:]/.test(s) ? idWords(s) : s.trim()) : '');

/**
 * Two names joined without saying a word twice: the end of `a` that `b` starts with is said once
 * ("steer tire" + "tire pressure" → "steer tire pressure"; "rear impact guard" twice → once), and
 * when `b` starts with a word `a` already has, `b` names the thing more closely and replaces `a` from
 * that word on ("air system" + "air buildup" → "air buildup"). `null` when nothing overlaps.
 */
function mergeOverlap(a: string, b: string): string | null {
  const aw = words(a);
  const bw = words(b);
  if (!aw.length || !bw.length) return null;
  const same = (x: string, y: string) => x.toLowerCase() === y.toLowerCase();
  for (let k = Math.min(aw.length, bw.length); k > 0; k--) {
    if (aw.slice(aw.length - k).every((w, i) => same(w, bw[i]!))) return [...aw, ...bw.slice(k)].join(' ');
  }
  const at = aw.findIndex((w) => same(w, bw[0]!));
  if (at >= 0) return [...aw.slice(0, at), ...bw].join(' ');
  return null;
}

/** Names joined into one phrase, each overlap said once ("steer tire", "tire pressure" → "steer tire pressure"). */
export function joinName(parts: readonly (string | null | undefined)[], separator = ' '): string {
  let out = '';
  for (const part of parts.map(plain).filter(Boolean)) {
    if (!out) out = part;
    else out = mergeOverlap(out, part) ?? `${out}${separator}${part}`;
  }
  return collapseRepeats(out);
}

/**
 * A run of words said twice in a row said once, punctuation aside ("tire tire" → "tire",
 * "steer tire, tire pressure" → "steer tire pressure"). Numbers are left alone ("2 2" may be meant).
 */
export function collapseRepeats(text: string): string {
  const ws = words(text);
  const key = (w: string) => w.toLowerCase().replace(/[^\p{L}]/gu, '');
  const isWord = (w: string) => /^[\p{L}][\p{L}'-]*[,:;.]?$/u.test(w);
  for (let n = Math.min(4, Math.floor(ws.length / 2)); n >= 1; n--) {
    for (let i = 0; i + 2 * n <= ws.length; i++) {
      const run = ws.slice(i, i + 2 * n);
      if (!run.every(isWord)) continue;
      if (run.slice(0, n).every((w, j) => key(w) === key(run[n + j]!))) {
        ws.splice(i, n);
        i = Math.max(-1, i - 2 * n);
      }
    }
  }
  return ws.join(' ');
}

/** A quantity in the words a mechanic writes: "4/32 in", "95 psi", "45 s", "1.5 in". */
export function formatQuantity(value: number | string | null | undefined, unit: string | null | undefined): string {
  if (value === null || value === undefined || value === '') return '—';
  const v = typeof value === 'number' ? String(Math.round(value * 1000) / 1000) : String(value).trim();
  const u = (unit ?? '').trim();
  if (/^32nds?( of an inch)?$/.test(u)) return `${v}/32 in`;
  const unitWords: Record<string, string> = {
    s: 's',
    sec: 's',
    seconds: 's',
    min: 'min',
    psi: 'psi',
    'psi/min': 'psi per minute',
    in: 'in',
    inch: 'in',
    inches: 'in',
    deg: '°',
    degrees: '°',
    count: '',
  };
  const shown = unitWords[u] ?? u.replace(/_/g, ' ');
  if (shown === '°') return `${v}°`;
  return shown ? `${v} ${shown}` : v;
}

/** A stored limit text ("4 32nds", "100 psi", "≥ 4 32nds") in words: "4/32 in", "100 psi". */
export function formatLimitText(limitText: string | null | undefined): string {
  if (!limitText) return '—';
  const m = /^\s*([<>≤≥=]*\s*)?(-?\d+(?:\.\d+)?)\s*(.*)$/.exec(limitText);
  if (!m) return tidyText(limitText);
  return `${m[1] ?? ''}${formatQuantity(m[2], m[3] ?? '')}`;
}

const sideWords = new Set(['left', 'right', 'front', 'rear', 'inner', 'outer', 'inside', 'outside', 'top', 'bottom']);

/**
 * The name of a finding from its component, position and condition, each word said once:
 * "left steer tire: bulge", "brake chamber, axle 2: audible air leak",
 * "steer tire pressure below the limit" (a condition that starts with the component's words).
 */
export function nameFinding({
  component,
  condition,
  position,
}: {
  component: string | null | undefined;
  condition?: string | null;
  position?: string | null;
}): string {
  const pos = plain(position);
  const side = pos && words(pos).every((w) => sideWords.has(w.toLowerCase()));
  const comp = plain(component);
  const thing = side ? joinName([pos, comp]) : comp;
  const where = !side && pos ? `, ${pos}` : '';
  const cond = plain(condition);
  if (!cond) return collapseRepeats(`${thing}${where}`) || 'finding';
  if (!thing) return cond;
  const merged = mergeOverlap(thing, cond);
  if (merged !== null && !where) return collapseRepeats(merged);
  return collapseRepeats(`${thing}${where}: ${cond}`);
}

/**
 * The name of a reading: the component and the check said once, the value and its limit in words:
 * "steer tire pressure: 88 psi (limit 100 psi)", "air buildup: 62 s (limit 45 s)".
 */
export function nameReading({
  component,
  check,
  value,
  unit,
  limitText,
}: {
  component: string | null | undefined;
  check: string | null | undefined;
  value?: number | string | null;
  unit?: string | null;
  limitText?: string | null;
}): string {
  const name = joinName([component, check ?? 'reading']) || 'reading';
  const measured = value === undefined ? '' : `: ${formatQuantity(value, unit)}`;
  const limit = limitText ? ` (limit ${formatLimitText(limitText)})` : '';
  return `${name}${measured}${limit}`;
}

const pluralRules = new Intl.PluralRules('en-US');

/**
 * A count and its noun through Intl.PluralRules: countWords(1, 'defect') → "1 defect",
 * countWords(3, 'defect') → "3 defects"; an irregular plural is given: countWords(2, 'die', 'dice').
 */
export function countWords(n: number, singular: string, plural = `${singular}s`): string {
  return `${n} ${pluralRules.select(n) === 'one' ? singular : plural}`;
}

/** The noun alone for a count: nounFor(1, 'defect') → "defect", nounFor(2, 'defect') → "defects". */
export function nounFor(n: number, singular: string, plural = `${singular}s`): string {
  return pluralRules.select(n) === 'one' ? singular : plural;
}

/**
 * A limit's source as a reader should see it: its regulation ("49 CFR 393.75(b)"), or "common
 * practice" for a rule of thumb; how sure the project is of a value is not the reader's business.
 * A fleet's own stricter limit reads "fleet setting (published: 49 CFR …)".
 */
export function sourceWords(source: string | null | undefined): string {
  if (!source) return 'no source';
  const strip = (s: string) =>
    s
      .replace(/\s*\((?:from memory|partly verified|unverified)[^)]*\)/gi, '')
      .replace(/\s*\[M\]\s*/g, ' ')
      .trim();
  const fleet = /^fleet setting;\s*published:\s*(.*)$/i.exec(source.trim());
  if (fleet) return `fleet setting (published: ${sourceWords(fleet[1])})`;
  const s = strip(source);
  if (/^common practice/i.test(s)) return 'common practice';
  return s || 'no source';
}

const statusText: Record<string, string> = {
  in_service: 'in service',
  out_of_service: 'out of service',
  retired: 'retired',
  open: 'open',
  repaired: 'repaired',
  no_repair_needed: 'no repair needed',
  pre_trip: 'pre-trip',
  post_trip: 'post-trip',
  draft: 'draft',
  submitted: 'submitted',
};

/** A stored status or kind in words: "unit.in_service" or "in_service" → "in service". */
export function statusWords(status: string): string {
  const last = status.split('.').at(-1) ?? status;
  return statusText[last] ?? idWords(last);
}

/** Raw ids and codes that must never reach a screen, mail, CSV cell or PDF line. */
export const rawIdPattern =
  /\b[a-z0-9]+(?:_[a-z0-9]+)+\b|\b\d+(?:\.\d+)? ?32nds\b|\bunit\.[a-z_]+\b|\(from memory|unverified\)/;

/**
 * Stored text made readable: term keys and ids in words ("steer_tire:bulge" → "steer tire, bulge"),
 * "4 32nds" → "4/32 in", "unit.in_service" → "in service", a word run said twice said once. For
 * descriptions written before the naming functions named them.
 */
export function tidyText(text: string | null | undefined): string {
  if (!text) return '';
  return collapseRepeats(
    text
      .replace(/\bunit\.([a-z_]+)\b/g, (_, s: string) => statusWords(s))
      .replace(/\b(\d+(?:\.\d+)?) ?32nds\b/g, '$1/32 in')
      .replace(/\b([a-z]+(?:_[a-z0-9]+)*):([a-z]+(?:_[a-z0-9]+)*)\b/g, (m: string, a: string, b: string) =>
        /_/.test(m) ? `${idWords(a)}, ${idWords(b)}` : m,
      )
      .replace(/\b[a-z]+(?:_[a-z0-9]+)+\b/g, (m) => idWords(m))
      .replace(/\s*\((?:from memory|partly verified)[^)]*\)/gi, ''),
  );
}
