'use client';

import { useState } from 'react';
import { useHydrated } from '@/components/ui/use-hydrated';
import { fieldClass } from '@/components/trainer/controls';
import { ScoreBar } from '@/components/trainer/score-bar';
import { useBenchMutation } from '@/lib/queries/vocabulary';
import { zoneIdSchema } from '@/lib/schemas/grammar';
import type { BenchMatch, BenchResult } from '@/lib/schemas/vocabulary';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';

type Recognition = {
  lang: string;
  maxAlternatives: number;
  onresult: ((e: { results: { 0: { transcript: string } }[] }) => void) | null;
  onend: (() => void) | null;
  start: () => void;
};

function speechCtor(): (new () => Recognition) | null {
  if (typeof window === 'undefined') return null;
  const w = window as unknown as {
    SpeechRecognition?: new () => Recognition;
    webkitSpeechRecognition?: new () => Recognition;
  };
  return w.SpeechRecognition ?? w.webkitSpeechRecognition ?? null;
}

export function BenchClient() {
  const [text, setText] = useState('');
  const [zone, setZone] = useState<string>('front');
  const [listening, setListening] = useState(false);
  const bench = useBenchMutation();
  const hydrated = useHydrated();
  const run = (t = text) => t.trim() && bench.mutate({ text: t.trim(), zone: zone ? (zone as never) : null });
  const speak = () => {
    const Ctor = speechCtor();
    if (!Ctor) return;
    const r = new Ctor();
    r.lang = 'en-US';
    r.onresult = (e) => {
      const said = e.results[0]?.[0].transcript ?? '';
      setText(said);
      run(said);
    };
    r.onend = () => setListening(false);
    setListening(true);
    r.start();
  };
  const result = bench.data;
  return (
    <div className="space-y-4">
      <form
        className={`${panelClass({ tone: 'quiet' })} flex flex-wrap items-end gap-3`}
        onSubmit={(e) => {
          e.preventDefault();
          run();
        }}
      >
        <label className="min-w-0 basis-full sm:min-w-[20rem] sm:grow sm:basis-auto">
          <span className="block text-sm font-bold">Utterance, as a driver would say it</span>
          <input
            className={fieldClass}
            value={text}
            onChange={(e) => setText(e.target.value)}
            placeholder="e.g. bubble on the passenger steer tyre"
            maxLength={400}
          />
        </label>
        <label>
          <span className="block text-sm font-bold">Zone</span>
          <select className={fieldClass} value={zone} onChange={(e) => setZone(e.target.value)}>
            <option value="">any zone</option>
            {zoneIdSchema.options.map((z) => (
              <option key={z} value={z}>
                {z.replace(/_/g, ' ')}
              </option>
            ))}
          </select>
        </label>
        <button type="submit" className={buttonClass('primary', 'compact')} disabled={!text.trim() || bench.isPending}>
          Try it
        </button>
        {hydrated && speechCtor() && (
          <button type="button" className={buttonClass('plain', 'compact')} onClick={speak} disabled={listening}>
            {listening ? '● Listening…' : '● Speak'}
          </button>
        )}
      </form>
      {bench.error && (
        <p role="alert" className="font-bold text-major">
          {bench.error.message}
        </p>
      )}
      {result && <BenchOutput result={result} />}
    </div>
  );
}

function BenchOutput({ result }: { result: BenchResult }) {
  return (
    <div className="space-y-3">
      <dl className={`${panelClass({ tone: 'quiet' })} grid grid-cols-[auto_1fr] gap-x-4 gap-y-1`}>
        <dt className="font-bold">Normalised</dt>
        <dd data-testid="bench-normalized">
          <code>{result.normalized || '—'}</code>
        </dd>
        <dt className="font-bold">Numbers found</dt>
        <dd>
          {result.numbers.length
            ? result.numbers.map((n, i) => (
                <span key={i} className="mr-3 tabular-nums">
                  “{n.words}” → <b>{n.value}</b> {n.unit ?? '(no unit)'}
                </span>
              ))
            : 'none'}
        </dd>
      </dl>
      <div className="grid gap-3 md:grid-cols-2">
        <MatchColumn title="Draft" side={result.draft} testId="bench-draft" empty="No draft is open." />
        <MatchColumn
          title="Published (drivers use it now)"
          side={result.published}
          testId="bench-published"
          empty="Nothing published: drivers use the built-in vocabulary."
        />
      </div>
    </div>
  );
}

function MatchColumn({
  title,
  side,
  testId,
  empty,
}: {
  title: string;
  side: BenchResult['draft'];
  testId: string;
  empty: string;
}) {
  return (
    <section className={panelClass({ tone: 'quiet' })} data-testid={testId} aria-label={title}>
      <h2 className="text-lg font-extrabold">{title}</h2>
      {!side ? <p className="text-muted">{empty}</p> : <RankedMatches label={side.label} match={side.match} />}
    </section>
  );
}

function RankedMatches({ label, match }: { label: string; match: BenchMatch }) {
  const ranked = [
    { termId: match.termId ?? '—', label: match.label, score: match.score },
    ...match.alternatives.filter((a) => a.termId !== match.termId),
  ];
  return (
    <div className="space-y-2">
      <p className="text-sm text-muted">{label}</p>
      <p className="text-xl font-bold" data-testid="bench-reading">
        {match.kind === 'unknown' ? '✕ nothing matched' : match.label}
      </p>
      <p className="text-sm">
        kind <b>{match.kind}</b>
        {match.position && (
          <>
            {' '}
            · position <b>{match.position}</b>
          </>
        )}
        {match.severity && <> · {match.severity === 'major' ? '■ major' : '△ minor'}</>}
        {match.value !== null && (
          <>
            {' '}
            · value{' '}
            <b className="tabular-nums">
              {match.value} {match.unit}
            </b>
          </>
        )}
      </p>
      <ol className="space-y-1">
        {ranked.map((r, i) => (
          <li
            key={`${r.termId}-${i}`}
            className="flex flex-wrap items-center justify-between gap-2 border-t border-edge/15 pt-1"
          >
            <span>
              <span className="text-muted tabular-nums">{i + 1}.</span> {r.label}{' '}
              <code className="text-sm text-muted">{r.termId}</code>
            </span>
            <ScoreBar score={r.score} />
          </li>
        ))}
      </ol>
    </div>
  );
}
