/**
 * Pure arithmetic for `npm run bench:speech`: word error rate, the noise gain for a target
 * signal-to-noise ratio, n-best confidences and a small ARPA n-gram writer. No I/O, unit-tested in
 * tests/unit/bench-speech-math.test.ts.
 */

/** Lower case, apostrophes kept, every other non-letter/digit a space; split on spaces. */
export function toWords(text: string): string[] {
  return text
    .toLowerCase()
    .replace(/[^a-z0-9' ]+/g, ' ')
    .split(/\s+/)
    .filter((w) => w !== '' && w !== "'");
}

/** Word-level edit distance (substitutions, insertions, deletions all cost 1). */
export function countWordEdits(reference: readonly string[], hypothesis: readonly string[]): number {
  const n = hypothesis.length;
  let prev = Array.from({ length: n + 1 }, (_, j) => j);
  for (let i = 1; i <= reference.length; i += 1) {
    const cur = [i];
    for (let j = 1; j <= n; j += 1) {
      const cost = reference[i - 1] === hypothesis[j - 1] ? 0 : 1;
      cur.push(Math.min((prev[j] ?? 0) + 1, (cur[j - 1] ?? 0) + 1, (prev[j - 1] ?? 0) + cost));
    }
    prev = cur;
  }
  return prev[n] ?? reference.length;
}

/**
 * Corpus word error rate: total edits over total reference words (the usual definition; it can
 * exceed 1 when the recogniser inserts many words).
 */
export function getWordErrorRate(pairs: readonly { reference: string; hypothesis: string }[]): number {
  let edits = 0;
  let words = 0;
  for (const p of pairs) {
    const ref = toWords(p.reference);
    edits += countWordEdits(ref, toWords(p.hypothesis));
    words += ref.length;
  }
  return words === 0 ? 0 : edits / words;
}

/** Signal-to-noise ratio in dB from two RMS amplitudes: 20·log10(speech / noise). */
export function getSnrDb(speechRms: number, noiseRms: number): number {
  return 20 * Math.log10(speechRms / noiseRms);
}

/** The factor to multiply the noise by so that speech over scaled noise is `snrDb` (RMS ratio). */
export function getNoiseGain(speechRms: number, noiseRms: number, snrDb: number): number {
  if (!(speechRms > 0) || !(noiseRms > 0)) throw new Error('RMS amplitudes must be positive');
  return speechRms / (noiseRms * 10 ** (snrDb / 20));
}

/**
 * Confidences for an n-best list from its log scores: a softmax with `scale` nats per score unit,
 * so that the list sums to 1 and the best-scored entry has the highest confidence.
 */
export function getNbestConfidences(scores: readonly number[], scale: number): number[] {
  if (scores.length === 0) return [];
  const top = Math.max(...scores);
  const exps = scores.map((s) => Math.exp((s - top) * scale));
  const sum = exps.reduce((a, b) => a + b, 0);
  return exps.map((e) => e / sum);
}

type Counts = Map<string, number>;

/**
 * An ARPA back-off language model (orders 1..`order`) from sentences, with interpolated absolute
 * discounting (discount `discount`) written in back-off form: for each history the back-off weight
 * makes the probabilities of every next word sum to one. Unigrams are add-one smoothed over the
 * vocabulary. `<s>` and `</s>` are added around each sentence.
 */
export function writeArpa(sentences: readonly string[][], order = 3, discount = 0.7): string {
  const counts: Counts[] = Array.from({ length: order + 1 }, () => new Map<string, number>());
  const followers: Map<string, Set<string>>[] = Array.from({ length: order + 1 }, () => new Map<string, Set<string>>());
  const historyTotals: Counts[] = Array.from({ length: order + 1 }, () => new Map<string, number>());
  for (const s of sentences) {
    const ws = ['<s>', ...s, '</s>'];
    for (let n = 1; n <= order; n += 1) {
      for (let i = 0; i + n <= ws.length; i += 1) {
        const gram = ws.slice(i, i + n);
        if (n === 1 && gram[0] === '<s>') {
          counts[1]?.set('<s>', (counts[1]?.get('<s>') ?? 0) + 1);
          continue;
        }
        const key = gram.join(' ');
        counts[n]?.set(key, (counts[n]?.get(key) ?? 0) + 1);
        if (n >= 2) {
          const h = gram.slice(0, -1).join(' ');
          const f = followers[n]?.get(h) ?? new Set<string>();
          f.add(gram[n - 1] ?? '');
          followers[n]?.set(h, f);
          historyTotals[n]?.set(h, (historyTotals[n]?.get(h) ?? 0) + 1);
        }
      }
    }
  }
  const vocab = [...(counts[1]?.keys() ?? [])].filter((w) => w !== '<s>');
  const total = vocab.reduce((a, w) => a + (counts[1]?.get(w) ?? 0), 0);
  const p1 = new Map(vocab.map((w) => [w, ((counts[1]?.get(w) ?? 0) + 1) / (total + vocab.length)]));
  const bows: Map<string, number>[] = Array.from({ length: order + 1 }, () => new Map<string, number>());
  const probs: Map<string, number>[] = Array.from({ length: order + 1 }, () => new Map<string, number>());
  for (const [w, p] of p1) probs[1]?.set(w, p);
  /** Back-off probability of w after history words h (any length < order). */
  const prob = (h: string[], w: string): number => {
    if (h.length === 0) return p1.get(w) ?? 0;
    const key = [...h, w].join(' ');
    const direct = probs[h.length + 1]?.get(key);
    if (direct !== undefined) return direct;
    const bow = bows[h.length]?.get(h.join(' ')) ?? 1;
    return bow * prob(h.slice(1), w);
  };
  for (let n = 2; n <= order; n += 1) {
    for (const [h, fs] of followers[n] ?? []) {
      const hw = h.split(' ');
      const tot = historyTotals[n]?.get(h) ?? 1;
      const gamma = (discount * fs.size) / tot;
      let seenHigh = 0;
      let seenLow = 0;
      for (const w of fs) {
        const c = counts[n]?.get(`${h} ${w}`) ?? 0;
        const low = prob(hw.slice(1), w);
        const p = Math.max(0, c - discount) / tot + gamma * low;
        probs[n]?.set(`${h} ${w}`, p);
        seenHigh += p;
        seenLow += low;
      }
      const bow = seenLow >= 1 - 1e-12 ? 1 : Math.max(1e-12, (1 - seenHigh) / (1 - seenLow));
      bows[n - 1]?.set(h, bow);
    }
  }
  const lg = (x: number) => (x > 0 ? Math.log10(x).toFixed(6) : '-99');
  const out: string[] = ['\\data\\'];
  const entries: string[][] = [[]];
  for (let n = 1; n <= order; n += 1) {
    const rows: string[] = [];
    if (n === 1) rows.push(`-99\t<s>\t${lg(bows[1]?.get('<s>') ?? 1)}`);
    for (const [key, p] of probs[n] ?? []) {
      const bow = n < order ? bows[n]?.get(key) : undefined;
      rows.push(bow !== undefined ? `${lg(p)}\t${key}\t${lg(bow)}` : `${lg(p)}\t${key}`);
    }
    entries.push(rows);
    out.push(`ngram ${n}=${rows.length}`);
  }
  for (let n = 1; n <= order; n += 1) {
    out.push('', `\\${n}-grams:`);
    for (const row of entries[n] ?? []) out.push(row);
  }
  out.push('', '\\end\\', '');
  return out.join('\n');
}

/** Read an ARPA text back into log10 probabilities and back-off weights (for tests and checks). */
export function readArpa(text: string): { probs: Map<string, number>; bows: Map<string, number> } {
  const probs = new Map<string, number>();
  const bows = new Map<string, number>();
  let inGrams = false;
  for (const line of text.split('\n')) {
    if (/^\\\d-grams:/.test(line)) {
      inGrams = true;
      continue;
    }
    if (line.startsWith('\\end')) break;
    if (!inGrams || line.trim() === '') continue;
    const [p, key, bow] = line.split('\t');
    if (p === undefined || key === undefined) continue;
    probs.set(key, Number(p));
    if (bow !== undefined) bows.set(key, Number(bow));
  }
  return { probs, bows };
}
