import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import Fuse from 'fuse.js';
import { getDefaultMatcher } from '@/lib/matcher';
import type { MatchResult, NbestAlternative } from '@/lib/matcher';
import { createPronouncer } from '@/lib/matcher/pronounce';
import { getLabelledContext, isTopOneCorrect, parseLabelledJsonl } from '@/lib/matcher/fixture-scoring';
import type { LabelledUtterance } from '@/lib/matcher/fixture-scoring';
import { getNbestConfidences, getNoiseGain, getSnrDb, getWordErrorRate, toWords, writeArpa } from './bench-speech-math';

/**
 * `npm run bench:speech [-- --json] [--set FILE] [--voices a,b] [--snr clean,15,5] [--models generic,domain] [--limit N]`
 *
 * The whole voice path through a real recogniser: each labelled utterance is spoken by Debian's
 * espeak-ng and flite, engine-like noise made by sox (brown noise, a 45 Hz rumble, pulsed at 13 Hz)
 * is mixed in at signal-to-noise ratios computed from RMS amplitudes (sox stat), pocketsphinx
 * recognises it with its generic US English model and with a language model built here only from
 * grammars/*.json (5-best lists), and the matcher and plain fuse.js score the result.
 * The domain model plays the part of the browser's phrase hints: it pulls every sound toward our
 * vocabulary, so the chatter lines measure rejection of out-of-vocabulary speech with hints on.
 * Audio and recognition results are cached under .data/bench-speech (keyed by text, voice, SNR,
 * model), so a rerun only matches and scores.
 */

const root = path.resolve(new URL('../', import.meta.url).pathname);
const cacheDir = path.join(root, '.data', 'bench-speech');
const MODEL = '/usr/share/pocketsphinx/model/en-us';
const PACKAGES = ['espeak-ng', 'flite', 'sox', 'pocketsphinx', 'pocketsphinx-en-us'];

const args = process.argv.slice(2);
const flag = (name: string): string | undefined => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? args[i + 1] : args.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3);
};
const json = args.includes('--json');
const setFiles = (flag('set') ?? 'held-out-spoken.jsonl').split(',');
const voices = (flag('voices') ?? 'espeak-en-us,flite-slt').split(',');
const snrs = (flag('snr') ?? 'clean,15,5').split(',');
const limit = Number(flag('limit') ?? 0);
/** `--dump FILE`: one JSON line per utterance and condition (heard, n-best, reading, outcome) for a closer look. */
const dumpFile = flag('dump');
const dump: string[] = [];
const log = (s: string) => process.stderr.write(`${s}\n`);

// ---------------------------------------------------------------- Debian packages

function ensurePackages(): void {
  const missing = PACKAGES.filter(
    (p) =>
      spawnSync('dpkg-query', ['-W', '-f=${Status}', p], { encoding: 'utf8' }).stdout.includes('ok installed') ===
      false,
  );
  if (missing.length === 0) return;
  if (process.getuid?.() !== 0)
    throw new Error(
      `missing Debian packages: ${missing.join(' ')}; install them with: sudo apt-get install -y ${missing.join(' ')}`,
    );
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  log(`apt-get install ${missing.join(' ')}…`);
  const first = spawnSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...missing], {
    env,
    stdio: 'inherit',
  });
  if (first.status !== 0) {
    execFileSync('apt-get', ['update', '-qq'], { env, stdio: 'inherit' });
    execFileSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...missing], { env, stdio: 'inherit' });
  }
}

// ---------------------------------------------------------------- the labelled set

const readJson = (p: string): unknown => JSON.parse(readFileSync(path.join(root, p), 'utf8'));
const hash = (...parts: string[]) => createHash('sha256').update(parts.join('\u0000')).digest('hex').slice(0, 16);

let utterances: LabelledUtterance[] = setFiles.flatMap((f) =>
  parseLabelledJsonl(readFileSync(path.join(root, 'tests/fixtures/matcher', f), 'utf8')),
);
if (limit > 0) utterances = utterances.slice(0, limit);

/** What the voice says: "32nds" read out, "o.k." as two letters. */
function toSpoken(text: string): string {
  return text.replace(/\b(\d+)\s*(32nds|32s)\b/g, '$1 thirty seconds').replace(/(\d+)\/32/g, '$1 thirty seconds');
}
/** The reference words for the word error rate, in the recogniser's spelling. */
function toReference(text: string): string {
  return toSpoken(text)
    .replace(/\bo\.k\./gi, 'o k')
    .replace(/\b32nds\b/g, 'thirty seconds');
}

// ---------------------------------------------------------------- the domain language model

type Vocabulary = {
  components: { phrases: string[]; defects: { condition: string }[] }[];
  conditions: { id: string; phrases: string[] }[];
};
type Commands = { commands: { id: string; phrases: string[] }[]; fillers: string[] };
type Positions = { positions: { phrases: string[] }[]; axleWords: string[]; ordinals: Record<string, number> };
type Numbers = { units: Record<string, number>; tens: Record<string, number>; fractions: Record<string, number> };
type Zones = { zones: { phrases: string[]; items: { label: string }[] }[] };
type Numbers2 = Numbers & { measureWords: Record<string, string[]>; unitWords: Record<string, string[]> };

function readDictionary(): Map<string, string[]> {
  const dict = new Map<string, string[]>();
  for (const line of readFileSync(path.join(MODEL, 'cmudict-en-us.dict'), 'utf8').split('\n')) {
    const sp = line.indexOf(' ');
    if (sp < 0) continue;
    const word = line.slice(0, sp).replace(/\(\d+\)$/, '');
    const list = dict.get(word) ?? [];
    list.push(line.slice(sp + 1).trim());
    dict.set(word, list);
  }
  return dict;
}

/** Sentences from the grammar files only: findings, readings, commands, the OK family, zone names. */
function buildDomainSentences(): string[][] {
  const vocabulary = readJson('grammars/vocabulary.json') as Vocabulary;
  const commands = readJson('grammars/commands.json') as Commands;
  const positions = readJson('grammars/positions.json') as Positions;
  const numbers = readJson('grammars/numbers.json') as Numbers2;
  const zones = readJson('grammars/zones.json') as Zones;
  const words = (s: string) => toWords(s.replace(/-/g, ' '));
  const out: string[][] = [];
  const conds = new Map(vocabulary.conditions.map((c) => [c.id, c.phrases]));
  const posPhrases = positions.positions.flatMap((p) => p.phrases);
  let k = 0;
  const pick = <T>(xs: T[]): T => xs[k++ % xs.length] as T;
  for (const comp of vocabulary.components) {
    for (const cp of comp.phrases) {
      for (const d of comp.defects) {
        for (const dp of conds.get(d.condition) ?? []) {
          out.push(words(`${cp} ${dp}`));
          out.push(words(`${pick(posPhrases)} ${cp} is ${dp}`));
          out.push(words(`${dp} on the ${pick(posPhrases)} ${cp}`));
        }
      }
    }
  }
  for (const c of commands.commands) for (const p of c.phrases) out.push(words(p));
  for (const z of zones.zones) {
    for (const p of z.phrases) {
      out.push(words(p));
      for (const ok of commands.commands.find((c) => c.id === 'ok')?.phrases ?? []) out.push(words(`${p} ${ok}`));
    }
    for (const it of z.items) out.push(words(it.label));
  }
  // readings: spoken numbers with the measure and unit words of numbers.json
  const units = Object.keys(numbers.units).filter((w) => /^[a-z]+$/.test(w));
  const tens = Object.keys(numbers.tens).filter((w) => /^[a-z]+$/.test(w));
  const spoken: string[] = [...units];
  for (const t of tens)
    for (const u of units.filter((x) => (numbers.units[x] ?? 10) < 10 && (numbers.units[x] ?? 0) > 0))
      spoken.push(`${t} ${u}`);
  for (const t of tens) spoken.push(`one ${t}`, `a hundred and ${pick(units)}`, `one hundred ${t}`);
  spoken.push('one hundred', 'a hundred', 'one oh five', 'one ten', 'one twenty five');
  for (const f of Object.keys(numbers.fractions))
    spoken.push(`${pick(units)} ${f}`, `an inch and a ${f}`, `a ${f} inch`);
  for (const [, ps] of Object.entries(numbers.measureWords)) {
    for (const mw of ps) {
      for (const [, uws] of Object.entries(numbers.unitWords)) {
        out.push(words(`${mw} ${pick(spoken)} ${pick(uws)}`));
        out.push(words(`${pick(posPhrases)} ${mw} is ${pick(spoken)} ${pick(uws)}`));
      }
      out.push(words(`${mw} at ${pick(spoken)}`));
    }
  }
  for (const n of spoken) for (const uw of Object.values(numbers.unitWords).flat()) out.push(words(`${n} ${uw}`));
  for (const f of commands.fillers) out.push(words(f));
  return out.filter((s) => s.length > 0);
}

function buildDomainModel(): { lm: string; dict: string; words: number; dropped: string[]; guessed: string[] } {
  const sentences = buildDomainSentences();
  const key = hash('dict-with-fallback', JSON.stringify(sentences));
  const dir = path.join(cacheDir, 'lm', key);
  const lm = path.join(dir, 'domain.lm');
  const dictPath = path.join(dir, 'domain.dict');
  if (existsSync(lm) && existsSync(dictPath)) {
    const meta = JSON.parse(readFileSync(path.join(dir, 'meta.json'), 'utf8')) as {
      words: number;
      dropped: string[];
      guessed: string[];
    };
    return { lm, dict: dictPath, ...meta };
  }
  mkdirSync(dir, { recursive: true });
  const cmu = readDictionary();
  const table = new Map([...cmu].map(([w, ps]) => [w, ps[0] ?? '']));
  const pronounce = createPronouncer(table);
  // words the dictionary lacks get the matcher's own fallback (suffix, compound, spelling rules); digits are left out
  const dropped = new Set<string>();
  const guessed = new Set<string>();
  const kept = sentences.filter((s) => {
    const bad = s.filter((w) => !/^[a-z']+$/.test(w));
    for (const w of bad) dropped.add(w);
    return bad.length === 0;
  });
  const vocab = new Set(kept.flat());
  writeFileSync(lm, writeArpa(kept, 3));
  const dictLines: string[] = [];
  for (const w of [...vocab].sort()) {
    const prons = cmu.get(w) ?? [];
    if (prons.length === 0) {
      guessed.add(w);
      dictLines.push(`${w} ${pronounce(w.replace(/'/g, '')).join(' ')}`);
    } else prons.forEach((pron, i) => dictLines.push(`${i === 0 ? w : `${w}(${i + 1})`} ${pron}`));
  }
  writeFileSync(dictPath, `${dictLines.join('\n')}\n`);
  const meta = {
    words: vocab.size,
    dropped: [...dropped].sort(),
    guessed: [...guessed].sort(),
    sentences: kept.length,
  };
  writeFileSync(path.join(dir, 'meta.json'), JSON.stringify(meta));
  return { lm, dict: dictPath, words: meta.words, dropped: meta.dropped, guessed: meta.guessed };
}

// ---------------------------------------------------------------- audio

function soxRms(file: string): number {
  const r = spawnSync('sox', [file, '-n', 'stat'], { encoding: 'utf8' });
  const m = /RMS\s+amplitude:\s+([0-9.eE+-]+)/.exec(r.stderr);
  if (!m?.[1]) throw new Error(`sox stat gave no RMS for ${file}: ${r.stderr}`);
  return Number(m[1]);
}
function soxDuration(file: string): number {
  return Number(execFileSync('soxi', ['-D', file], { encoding: 'utf8' }).trim());
}

/** A clean 16 kHz mono utterance with 0.3 s of silence either side, cached by voice and text. */
function synthesize(voice: string, text: string): string {
  const dir = path.join(cacheDir, 'audio', voice);
  mkdirSync(dir, { recursive: true });
  const id = hash(voice, text);
  const out = path.join(dir, `${id}.wav`);
  if (existsSync(out)) return out;
  const raw = path.join(dir, `${id}.tts.wav`);
  const spoken = toSpoken(text);
  if (voice.startsWith('espeak-')) execFileSync('espeak-ng', ['-v', voice.slice(7), '-s', '150', '-w', raw, spoken]);
  else if (voice.startsWith('flite-')) execFileSync('flite', ['-voice', voice.slice(6), '-t', spoken, '-o', raw]);
  else throw new Error(`unknown voice ${voice} (use espeak-<voice> or flite-<voice>)`);
  execFileSync('sox', [raw, '-r', '16000', '-c', '1', '-b', '16', out, 'pad', '0.3', '0.3']);
  return out;
}

type Mixed = { wav: string; snr: number | null; clipped: boolean };

/** The utterance with engine-like noise at `snrDb` (RMS ratio, measured with sox stat), cached. */
function mixNoise(clean: string, snrDb: number | null): Mixed {
  if (snrDb === null) return { wav: clean, snr: null, clipped: false };
  const base = clean.replace(/\.wav$/, '');
  const noise = `${base}.noise.wav`;
  const out = `${base}.snr${snrDb}.wav`;
  const metaFile = `${out}.json`;
  if (existsSync(out) && existsSync(metaFile)) return JSON.parse(readFileSync(metaFile, 'utf8')) as Mixed;
  if (!existsSync(noise)) {
    const dur = soxDuration(clean).toFixed(3);
    // brown noise (a diesel's broadband roar), a 45 Hz rumble mixed in, the whole pulsed at 13 Hz like firing strokes
    execFileSync('sox', [
      '-R',
      '-n',
      '-r',
      '16000',
      '-c',
      '1',
      '-b',
      '16',
      noise,
      'synth',
      dur,
      'brownnoise',
      'synth',
      dur,
      'sine',
      'mix',
      '45',
      'tremolo',
      '13',
      '40',
      'gain',
      '-n',
      '-6',
    ]);
  }
  const speechRms = soxRms(clean);
  const noiseRms = soxRms(noise);
  const gain = getNoiseGain(speechRms, noiseRms, snrDb);
  const r = spawnSync('sox', ['-m', '-v', '1', clean, '-v', gain.toFixed(6), noise, out], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`sox mix failed: ${r.stderr}`);
  const scaledNoise = `${base}.noise${snrDb}.wav`;
  execFileSync('sox', [noise, scaledNoise, 'vol', gain.toFixed(6)]);
  const measured = getSnrDb(speechRms, soxRms(scaledNoise));
  const mixed: Mixed = { wav: out, snr: measured, clipped: /clip/i.test(r.stderr) };
  writeFileSync(metaFile, JSON.stringify(mixed));
  return mixed;
}

// ---------------------------------------------------------------- recognition

type Recognised = { hyp: string; nbest: { text: string; score: number }[] };

const cleanHyp = (s: string) =>
  s
    .replace(/<\/?s>|<sil>|\[[a-z_]+\]|\+\+[a-z]+\+\+/gi, ' ')
    .replace(/\(\d+\)/g, '')
    .replace(/\s+/g, ' ')
    .trim();

/** pocketsphinx_batch over every file of one condition, with a 5-best list each; cached per file. */
function recognise(
  files: string[],
  model: 'generic' | 'domain',
  domain: { lm: string; dict: string },
): Map<string, Recognised> {
  const lmArgs =
    model === 'generic'
      ? ['-lm', path.join(MODEL, 'en-us.lm.bin'), '-dict', path.join(MODEL, 'cmudict-en-us.dict')]
      : ['-lm', domain.lm, '-dict', domain.dict];
  const modelKey = model === 'generic' ? 'generic' : hash(readFileSync(domain.lm, 'utf8'));
  const results = new Map<string, Recognised>();
  const todo: { file: string; id: string; cache: string }[] = [];
  for (const f of files) {
    const id = hash(f, modelKey);
    const cache = path.join(cacheDir, 'asr', model, `${id}.json`);
    if (existsSync(cache)) results.set(f, JSON.parse(readFileSync(cache, 'utf8')) as Recognised);
    else todo.push({ file: f, id, cache });
  }
  if (todo.length === 0) return results;
  const work = path.join(cacheDir, 'work', `${model}-${Date.now()}`);
  mkdirSync(path.join(work, 'nbest'), { recursive: true });
  mkdirSync(path.join(cacheDir, 'asr', model), { recursive: true });
  for (const t of todo)
    execFileSync('sox', [
      t.file,
      '-t',
      'raw',
      '-r',
      '16000',
      '-c',
      '1',
      '-b',
      '16',
      '-e',
      'signed-integer',
      path.join(work, `${t.id}.raw`),
    ]);
  writeFileSync(path.join(work, 'ctl'), `${todo.map((t) => t.id).join('\n')}\n`);
  log(`pocketsphinx (${model} model): ${todo.length} utterances…`);
  const r = spawnSync(
    'pocketsphinx_batch',
    [
      '-hmm',
      path.join(MODEL, 'en-us'),
      ...lmArgs,
      '-ctl',
      path.join(work, 'ctl'),
      '-cepdir',
      work,
      '-cepext',
      '.raw',
      '-adcin',
      'yes',
      '-hyp',
      path.join(work, 'hyp'),
      '-nbest',
      '5',
      '-nbestdir',
      path.join(work, 'nbest'),
      '-logfn',
      path.join(work, 'log'),
    ],
    { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 },
  );
  if (r.status !== 0) throw new Error(`pocketsphinx_batch failed (${r.status}); see ${path.join(work, 'log')}`);
  const hyps = new Map<string, string>();
  for (const line of readFileSync(path.join(work, 'hyp'), 'utf8').split('\n')) {
    const m = /^(.*)\s\((\w+)\s-?\d+\)$/.exec(line);
    if (m?.[2]) hyps.set(m[2], cleanHyp(m[1] ?? ''));
  }
  const nbestFiles = new Set(readdirSync(path.join(work, 'nbest')));
  for (const t of todo) {
    const hyp = hyps.get(t.id) ?? '';
    const nbest: { text: string; score: number }[] = [];
    const nf = [...nbestFiles].find((n) => n.startsWith(t.id));
    if (nf) {
      for (const line of readFileSync(path.join(work, 'nbest', nf), 'utf8').split('\n')) {
        const m = /^(.*?)\s+(-?\d+)\s*$/.exec(line);
        if (!m) continue;
        const text = cleanHyp(m[1] ?? '');
        if (!nbest.some((x) => x.text === text)) nbest.push({ text, score: Number(m[2]) });
      }
    }
    if (nbest.length === 0 || (nbest[0]?.text !== hyp && !nbest.some((x) => x.text === hyp)))
      nbest.unshift({ text: hyp, score: nbest[0]?.score ?? 0 });
    const rec: Recognised = { hyp, nbest };
    writeFileSync(t.cache, JSON.stringify(rec));
    results.set(t.file, rec);
  }
  return results;
}

// ---------------------------------------------------------------- matching and scoring

type Outcome = 'right' | 'confirmed' | 'asked' | 'wrong' | 'chatter_rejected' | 'chatter_accepted';

/** Scale for pocketsphinx 5-best scores (acoustic scores are kept shifted by 10 bits in log base 1.0001, then ÷ the -ascale default 20). */
const NBEST_SCALE = (1024 * Math.log(1.0001)) / 20;

function classify(u: LabelledUtterance, r: MatchResult): Outcome {
  const chatter = u.kind === 'unknown' || !u.kind;
  if (chatter) return r.kind !== 'unknown' && !r.needsConfirmation ? 'chatter_accepted' : 'chatter_rejected';
  const right = isTopOneCorrect(u, r);
  if (r.kind !== 'unknown' && !r.needsConfirmation) return right ? 'right' : 'wrong';
  if (right) return 'confirmed';
  if (u.kind === 'defect' && r.alternatives.slice(0, 2).some((a) => a.termId === u.termId)) return 'confirmed';
  return 'asked';
}

const matcher = getDefaultMatcher();
const grammarVocabulary = readJson('grammars/vocabulary.json') as Vocabulary & {
  components: { id: string; phrases: string[]; defects: { condition: string }[] }[];
};
const grammarCommands = readJson('grammars/commands.json') as Commands;

/**
 * Plain fuse.js (default options) over "component condition" phrases and every command phrase. All
 * 35,000 component × condition phrases take about 1.5 s a search here, so each term keeps its first
 * two component phrases × first two condition phrases (a few thousand phrases).
 */
const fusePhrases = (() => {
  const conds = new Map(grammarVocabulary.conditions.map((c) => [c.id, c.phrases.slice(0, 2)]));
  const out: { text: string; termId: string }[] = [];
  for (const comp of grammarVocabulary.components)
    for (const cp of comp.phrases.slice(0, 2))
      for (const d of comp.defects)
        for (const dp of conds.get(d.condition) ?? [])
          out.push({ text: `${cp} ${dp}`, termId: `${comp.id}:${d.condition}` });
  for (const c of grammarCommands.commands) for (const p of c.phrases) out.push({ text: p, termId: `command:${c.id}` });
  return out;
})();
const fuse = new Fuse(fusePhrases, { keys: ['text'], includeScore: true });
/** fuse.js scores 0 (exact) .. 1; at or below this its best hit is recorded, above it the app would ask. */
const FUSE_ACCEPT = 0.25;

const fuseCacheFile = path.join(cacheDir, `fuse-${hash(JSON.stringify(fusePhrases))}.json`);
const fuseCache = new Map<string, { termId: string; score: number }[]>(
  existsSync(fuseCacheFile)
    ? (JSON.parse(readFileSync(fuseCacheFile, 'utf8')) as [string, { termId: string; score: number }[]][])
    : [],
);
function searchFuse(text: string): { termId: string; score: number }[] {
  const hit = fuseCache.get(text);
  if (hit) return hit;
  const res = text.trim()
    ? fuse.search(text, { limit: 10 }).map((h) => ({ termId: h.item.termId, score: h.score ?? 1 }))
    : [];
  fuseCache.set(text, res);
  return res;
}

function classifyFuse(u: LabelledUtterance, text: string): Outcome {
  const hits = searchFuse(text);
  const best = hits[0];
  const chatter = u.kind === 'unknown' || !u.kind;
  const ids = [...new Set(hits.map((h) => h.termId))];
  const want =
    u.kind === 'defect'
      ? u.termId
      : u.kind === 'command' || u.kind === 'ok'
        ? `command:${u.command ?? 'ok'}`
        : undefined;
  if (chatter) return best && (best.score ?? 1) <= FUSE_ACCEPT ? 'chatter_accepted' : 'chatter_rejected';
  if (!best) return 'asked';
  const accepted = (best.score ?? 1) <= FUSE_ACCEPT;
  const right = want !== undefined && best.termId === want;
  if (accepted) return right ? 'right' : 'wrong';
  return want !== undefined && ids.slice(0, 3).includes(want) ? 'confirmed' : 'asked';
}

type Tally = Record<Outcome, number>;
const emptyTally = (): Tally => ({
  right: 0,
  confirmed: 0,
  asked: 0,
  wrong: 0,
  chatter_rejected: 0,
  chatter_accepted: 0,
});

type Row = {
  model: string;
  snr: string;
  measured_snr_db: number | null;
  wer: number;
  n: number;
  chatter: number;
  pipelines: Record<
    string,
    { correct: number; confirmed: number; asked_or_unknown: number; wrong_unasked: number; chatter_accepted: number }
  >;
};

function summarise(t: Tally) {
  const labelled = t.right + t.confirmed + t.asked + t.wrong;
  const chatter = t.chatter_accepted + t.chatter_rejected;
  const r = (x: number, n: number) => (n === 0 ? 0 : Math.round((x / n) * 1000) / 1000);
  return {
    correct: r(t.right, labelled),
    confirmed: r(t.confirmed, labelled),
    asked_or_unknown: r(t.asked, labelled),
    wrong_unasked: r(t.wrong, labelled),
    chatter_accepted: r(t.chatter_accepted, chatter),
  };
}

// ---------------------------------------------------------------- main

ensurePackages();
mkdirSync(cacheDir, { recursive: true });
const domain = buildDomainModel();
log(
  `domain model: ${domain.words} words from grammars/; ${domain.guessed.length} not in the recogniser's dictionary pronounced by the matcher's fallback (${domain.guessed.slice(0, 10).join(', ')}…); sentences with digits left out (${domain.dropped.join(', ')})`,
);

log(`plain fuse.js over ${fusePhrases.length} phrases`);
log(`synthesising ${utterances.length} utterances × ${voices.length} voices…`);
const clean = new Map<string, string>(); // `${voice}\u0000${text}` → wav
for (const v of voices) for (const u of utterances) clean.set(`${v}\u0000${u.text}`, synthesize(v, u.text));

const rows: Row[] = [];
const models = (flag('models') ?? 'generic,domain')
  .split(',')
  .filter((m): m is 'generic' | 'domain' => m === 'generic' || m === 'domain');
for (const model of models) {
  for (const snrName of snrs) {
    const snrDb = snrName === 'clean' ? null : Number(snrName);
    const items: { u: LabelledUtterance; voice: string; mixed: Mixed }[] = [];
    for (const v of voices)
      for (const u of utterances)
        items.push({ u, voice: v, mixed: mixNoise(clean.get(`${v}\u0000${u.text}`) ?? '', snrDb) });
    const recs = recognise(
      items.map((i) => i.mixed.wav),
      model,
      domain,
    );
    const tallies: Record<string, Tally> = {
      'RigCall n-best': emptyTally(),
      'RigCall top': emptyTally(),
      'plain fuse.js': emptyTally(),
    };
    const werPairs: { reference: string; hypothesis: string }[] = [];
    let chatterN = 0;
    for (const it of items) {
      const rec = recs.get(it.mixed.wav) ?? { hyp: '', nbest: [] };
      werPairs.push({ reference: toReference(it.u.text), hypothesis: rec.hyp });
      if (it.u.kind === 'unknown' || !it.u.kind) chatterN += 1;
      const ctx = getLabelledContext(it.u);
      // the decoder's best path comes first (its 5-best search can rank it lower), scored as the best entry
      const top = Math.max(...rec.nbest.map((x) => x.score));
      const ordered = [{ text: rec.hyp, score: top }, ...rec.nbest.filter((x) => x.text !== rec.hyp)];
      const conf = getNbestConfidences(
        ordered.map((x) => x.score),
        NBEST_SCALE,
      );
      const alts: NbestAlternative[] = ordered.map((x, i) => ({ transcript: x.text, confidence: conf[i] ?? 0 }));
      const rN = matcher.matchNbest(alts, ctx);
      const rT = matcher.match(rec.hyp, ctx);
      const tn = tallies['RigCall n-best'];
      const tt = tallies['RigCall top'];
      const tf = tallies['plain fuse.js'];
      if (tn) tn[classify(it.u, rN)] += 1;
      if (dumpFile)
        dump.push(
          JSON.stringify({
            model,
            snr: snrName,
            voice: it.voice,
            text: it.u.text,
            want: it.u.termId ?? it.u.command ?? it.u.measure ?? it.u.kind,
            hyp: rec.hyp,
            nbest: alts,
            got: rN.termId,
            value: rN.value,
            score: rN.score,
            ask: rN.needsConfirmation,
            outcome: classify(it.u, rN),
          }),
        );
      if (tt) tt[classify(it.u, rT)] += 1;
      if (tf) tf[classifyFuse(it.u, rec.hyp)] += 1;
    }
    const snrVals = items.map((i) => i.mixed.snr).filter((x): x is number => x !== null);
    const row: Row = {
      model,
      snr: snrName,
      measured_snr_db: snrVals.length
        ? Math.round((snrVals.reduce((a, b) => a + b, 0) / snrVals.length) * 10) / 10
        : null,
      wer: Math.round(getWordErrorRate(werPairs) * 1000) / 1000,
      n: items.length,
      chatter: chatterN,
      pipelines: Object.fromEntries(Object.entries(tallies).map(([k, t]) => [k, summarise(t)])),
    };
    rows.push(row);
    writeFileSync(fuseCacheFile, JSON.stringify([...fuseCache]));
  }
}

const pct = (x: number) => `${(x * 100).toFixed(1)}%`.padStart(7);
console.log(
  `bench:speech — ${utterances.length} labelled utterances (${setFiles.join(', ')}) × voices ${voices.join(', ')}; pocketsphinx 5-best; domain model = phrase hints (${domain.words} words from grammars/)`,
);
console.log(
  'shares of labelled utterances (chatter lines apart): correct = recorded right without asking; confirmed = right after "did you mean"; asked = asked or unknown without the right choice; WRONG = recorded wrong without asking',
);
console.log(
  `${'model'.padEnd(8)} ${'snr'.padEnd(6)} ${'meas dB'.padStart(7)} ${'WER'.padStart(7)}  ${'pipeline'.padEnd(15)} ${'correct'.padStart(7)} ${'confirm'.padStart(7)} ${'asked'.padStart(7)} ${'WRONG'.padStart(7)} ${'chatter'.padStart(7)}`,
);
for (const r of rows) {
  for (const [name, p] of Object.entries(r.pipelines)) {
    console.log(
      `${r.model.padEnd(8)} ${r.snr.padEnd(6)} ${(r.measured_snr_db === null ? '-' : r.measured_snr_db.toFixed(1)).padStart(7)} ${pct(r.wer)}  ${name.padEnd(15)} ${pct(p.correct)} ${pct(p.confirmed)} ${pct(p.asked_or_unknown)} ${pct(p.wrong_unasked)} ${pct(p.chatter_accepted)}`,
    );
  }
}
if (dumpFile) writeFileSync(dumpFile, `${dump.join('\n')}\n`);
if (json) console.log(JSON.stringify({ set: setFiles, voices, utterances: utterances.length, rows }));
