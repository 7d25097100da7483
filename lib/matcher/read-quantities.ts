import type { NumberWords, Unit } from '@/lib/schemas/grammar';

/** A number found in the utterance, with the unit said after it (if any). Tokens [start, end). */
export type Quantity = { value: number; unit: Unit | null; start: number; end: number; fractionOnly: boolean };

export type QuantityReader = (tokens: readonly string[], opts?: { timeContext?: boolean }) => Quantity[];

type Expr = { value: number; end: number; fractionOnly: boolean };

const DIGITS = /^\d+(?:\.\d+)?$/;
const SLASH = /^(\d+)\/(\d+)$/;
const CLOCK = /^(\d{1,2}):(\d{2})$/;

/**
 * Build the spoken-number reader: cardinals ("one hundred and five"), the trade's idioms
 * ("one twenty five" = 125, "five thirty seconds" = 5/32 in, "two and a half", "an inch and a half",
 * "one minute twenty seconds" = 80 s), digits the recogniser writes ("6/32", "2 1/2", "1:20").
 */
export function createQuantityReader(words: NumberWords): QuantityReader {
  const units = new Map(Object.entries(words.units));
  const tens = new Map(Object.entries(words.tens));
  const scales = new Map(Object.entries(words.scales));
  const fractions = new Map(Object.entries(words.fractions));
  const ambiguous = new Set(words.ambiguousUnitWords);
  const unitPhrases: { unit: Unit; tokens: string[] }[] = [];
  for (const [unit, phrases] of Object.entries(words.unitWords) as [Unit, string[]][]) {
    for (const p of phrases) unitPhrases.push({ unit, tokens: p.split(' ') });
  }
  unitPhrases.sort((a, b) => b.tokens.length - a.tokens.length);

  const matchUnit = (t: readonly string[], i: number, afterFraction = false): { unit: Unit; end: number } | null => {
    let j = i;
    if ((t[j] === 'of' && (t[j + 1] === 'an' || t[j + 1] === 'a')) || t[j] === 'an') j += t[j] === 'of' ? 2 : 0;
    // "half an inch", "a quarter of an inch"
    if (afterFraction && (t[j] === 'an' || t[j] === 'a')) j += 1;
    for (const k of [j, i]) {
      for (const p of unitPhrases) {
        if (p.tokens.every((w, n) => t[k + n] === w)) return { unit: p.unit, end: k + p.tokens.length };
      }
    }
    return null;
  };
  const isThirtySecond = (t: readonly string[], i: number) =>
    t[i] === 'thirty' && (t[i + 1] === 'second' || t[i + 1] === 'seconds');
  const isNumberWord = (w: string | undefined) =>
    w !== undefined && !ambiguous.has(w) && (units.has(w) || tens.has(w) || scales.has(w) || DIGITS.test(w));

  /** Below one hundred: "seven", "fifteen", "forty", "forty five". Stops before "thirty seconds" when asked. */
  const readSmall = (t: readonly string[], i: number, allowAmbiguous: boolean, stopAtThirty: boolean) => {
    const w = t[i];
    if (w === undefined) return null;
    if (tens.has(w)) {
      if (stopAtThirty && isThirtySecond(t, i)) return null;
      const v = tens.get(w) ?? 0;
      const u = t[i + 1];
      const uv = u !== undefined && !ambiguous.has(u) ? units.get(u) : undefined;
      if (uv !== undefined && uv >= 1 && uv <= 9) return { value: v + uv, end: i + 2 };
      return { value: v, end: i + 1 };
    }
    const uv = units.get(w);
    if (uv !== undefined && (allowAmbiguous || !ambiguous.has(w))) return { value: uv, end: i + 1 };
    return null;
  };

  /** A whole cardinal below ten thousand, with "a hundred", "hundred and five", "twelve hundred". */
  const readCardinal = (
    t: readonly string[],
    i: number,
    allowAmbiguous: boolean,
  ): { value: number; end: number } | null => {
    let j = i;
    let total = 0;
    let current = 0;
    let any = false;
    if ((t[j] === 'a' || t[j] === 'an') && t[j + 1] !== undefined && scales.has(t[j + 1] ?? '')) {
      current = 1;
      j += 1;
      any = true;
    }
    for (;;) {
      const w = t[j];
      if (w === undefined) break;
      const sc = scales.get(w);
      if (sc !== undefined) {
        current = (current === 0 ? 1 : current) * sc;
        if (sc >= 1000) {
          total += current;
          current = 0;
        }
        j += 1;
        any = true;
        if (t[j] === 'and' && isNumberWord(t[j + 1]) && !fractions.has(t[j + 1] ?? '')) j += 1;
        continue;
      }
      if (any && current % 100 !== 0) break;
      if (any && current > 0 && current < 100) break;
      const small = readSmall(t, j, allowAmbiguous || any, any || j > i);
      if (!small) break;
      if (any && current >= 100 && current % 100 === 0) {
        current += small.value;
        j = small.end;
        if (!scales.has(t[j] ?? '')) break;
        continue;
      }
      current += small.value;
      j = small.end;
      any = true;
      if (!scales.has(t[j] ?? '')) break;
    }
    if (!any) return null;
    return { value: total + current, end: j };
  };

  const readFraction = (t: readonly string[], i: number): { value: number; end: number } | null => {
    // "a half", "half", "three quarters", "an eighth", "five sixteenths"
    let j = i;
    let n = 1;
    if (t[j] === 'a' || t[j] === 'an') j += 1;
    else {
      const uv = units.get(t[j] ?? '');
      if (uv !== undefined && uv > 0 && !ambiguous.has(t[j] ?? '') && fractions.has(t[j + 1] ?? '')) {
        n = uv;
        j += 1;
      }
    }
    const f = fractions.get(t[j] ?? '');
    if (f === undefined) return null;
    // a bare "third", "quarter", "eighth" is a place ("third axle"), unless an inch follows ("quarter inch")
    if (j === i && (t[j] === 'third' || t[j] === 'quarter' || t[j] === 'eighth') && t[j + 1] !== 'inch') return null;
    return { value: n * f, end: j + 1 };
  };

  const readExpr = (t: readonly string[], i: number, timeContext: boolean): Expr | null => {
    const w = t[i];
    if (w === undefined) return null;
    const slash = SLASH.exec(w);
    if (slash) {
      const den = Number(slash[2]);
      if (den === 0) return null;
      return { value: Number(slash[1]) / den, end: i + 1, fractionOnly: true };
    }
    let base: { value: number; end: number } | null = null;
    if (DIGITS.test(w)) {
      base = { value: Number(w), end: i + 1 };
      const next = SLASH.exec(t[i + 1] ?? '');
      if (next && Number(next[2]) > 0) base = { value: base.value + Number(next[1]) / Number(next[2]), end: i + 2 };
    } else {
      const frac = readFraction(t, i);
      if (frac) return { ...frac, fractionOnly: true };
      const allowAmb = !ambiguous.has(w) || matchUnit(t, i + 1) !== null;
      base = readCardinal(t, i, allowAmb);
      if (base && base.value < 10 && t[i] !== 'a' && !scales.has(t[base.end - 1] ?? '')) {
        // "one twenty five" → 125 (or 1:25 in a timing step); "one oh five" → 105
        const j = base.end;
        if ((t[j] === 'oh' || t[j] === 'o' || t[j] === 'zero') && units.has(t[j + 1] ?? '')) {
          const d = units.get(t[j + 1] ?? '') ?? 0;
          if (d >= 1 && d <= 9) base = { value: base.value * (timeContext ? 60 : 100) + d, end: j + 2 };
        } else if (!isThirtySecond(t, j)) {
          const two = readSmall(t, j, false, true);
          if (two && two.value >= 10 && (!timeContext || two.value < 60)) {
            base = { value: base.value * (timeContext ? 60 : 100) + two.value, end: two.end };
          }
        }
      }
      if (base && t[base.end] === 'point') {
        let k = base.end + 1;
        let digits = '';
        while (k < t.length && units.has(t[k] ?? '') && (units.get(t[k] ?? '') ?? 10) < 10) {
          digits += String(units.get(t[k] ?? ''));
          k += 1;
        }
        if (digits) base = { value: Number(`${base.value}.${digits}`), end: k };
      }
    }
    if (!base) return null;
    // "and a half", "and three quarters"
    if (t[base.end] === 'and') {
      const frac = readFraction(t, base.end + 1);
      if (frac && frac.value < 1) return { value: base.value + frac.value, end: frac.end, fractionOnly: false };
    }
    return { ...base, fractionOnly: false };
  };

  return (tokens, opts = {}) => {
    const out: Quantity[] = [];
    const timeContext = opts.timeContext === true || tokens.includes('minute') || tokens.includes('minutes');
    for (let i = 0; i < tokens.length;) {
      const w = tokens[i] ?? '';
      const clock = CLOCK.exec(w);
      if (clock) {
        out.push({
          value: Number(clock[1]) * 60 + Number(clock[2]),
          unit: 's',
          start: i,
          end: i + 1,
          fractionOnly: false,
        });
        i += 1;
        continue;
      }
      // "a minute", "an inch and a half"
      let expr: Expr | null = null;
      if (
        (w === 'a' || w === 'an') &&
        matchUnit(tokens, i + 1)?.unit !== undefined &&
        !fractions.has(tokens[i + 1] ?? '')
      ) {
        const u = matchUnit(tokens, i + 1);
        if (u && (u.unit === 'min' || u.unit === 'in' || u.unit === 's'))
          expr = { value: 1, end: i + 1, fractionOnly: false };
      }
      expr ??= readExpr(tokens, i, timeContext);
      if (!expr) {
        i += 1;
        continue;
      }
      let value = expr.value;
      let end = expr.end;
      let unit: Unit | null = null;
      const u = matchUnit(tokens, end, expr.fractionOnly);
      if (u) {
        unit = u.unit;
        end = u.end;
        const firstUnitWord = tokens[expr.end];
        if (unit === '32nds' && firstUnitWord === 'thirty' && (timeContext || expr.fractionOnly)) {
          // "one minute thirty seconds" or "a half thirty seconds" is time, not tread
          unit = 's';
          value = timeContext && !expr.fractionOnly ? value * 60 + 30 : 30;
        }
        if (unit === 'min') {
          value *= 60;
          unit = 's';
          if (tokens[end] === 'and') {
            const frac = readFraction(tokens, end + 1);
            if (frac && frac.value < 1) {
              value += frac.value * 60;
              end = frac.end;
            }
          }
          const rest = readExpr(tokens, tokens[end] === 'and' ? end + 1 : end, false);
          if (rest) {
            const ru = matchUnit(tokens, rest.end);
            if (!ru || ru.unit === 's' || ru.unit === '32nds') {
              value += rest.value;
              end = ru ? ru.end : rest.end;
            }
          } else if (isThirtySecond(tokens, end)) {
            value += 30;
            end += 2;
          }
        } else if (tokens[end] === 'and') {
          const frac = readFraction(tokens, end + 1);
          if (frac && frac.value < 1) {
            value += frac.value;
            end = frac.end;
          }
        }
      } else if (expr.fractionOnly) {
        const slash = SLASH.exec(w);
        if (slash && Number(slash[2]) === 32) {
          unit = '32nds';
          value = Number(slash[1]);
        }
      }
      out.push({ value, unit, start: i, end, fractionOnly: expr.fractionOnly && unit === null });
      i = end;
    }
    return out;
  };
}
