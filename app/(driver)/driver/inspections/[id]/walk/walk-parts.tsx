'use client';
// Pieces of the walk screen. Every control is a slab at least 64 px high, for a gloved thumb.

import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { SeverityMark } from '@/components/ui/severity-mark';
import type { QueueStatus } from '@/lib/inspection/use-flush-queue';
import type { PendingMatch, WalkStep } from '@/lib/inspection/store';
import type { ItemAnswer } from '@/lib/walk';
import { compareSeal, readSpokenSeal } from '@/lib/inspection/seal-check';

export const inputClass = 'min-h-target w-full rounded-lg border-slab border-edge bg-panel px-4 text-2xl text-ink';

export function AnswerMark({ answer }: { answer: ItemAnswer | undefined }) {
  if (answer === 'ok' || answer === 'measured')
    return <span className="font-bold text-pass">✓ {answer === 'ok' ? 'OK' : 'measured'}</span>;
  if (answer === 'not_checked') return <span className="font-bold">– not checked</span>;
  if (answer === 'defect' || answer === 'failed') return <span className="font-bold text-major">▲ defect</span>;
  return <span className="text-muted">○ open</span>;
}

const minutes = (ms: number) => `${Math.floor(ms / 60000)}:${String(Math.floor((ms % 60000) / 1000)).padStart(2, '0')}`;

/** "3 32nds" reads badly: tread depth is said and written in thirty-seconds of an inch. */
export function formatReading(value: number | undefined | null, unit: string): string {
  if (value === undefined || value === null) return '';
  return unit === '32nds' ? `${value}/32 in` : `${value} ${unit}`;
}

export const capitalize = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

export function WalkStatusBar({
  zoneName,
  zoneNumber,
  zoneCount,
  startedAt,
  minimumMinutes,
  queue,
  itemsLeft,
  children,
}: {
  zoneName: string;
  zoneNumber: number;
  zoneCount: number;
  startedAt: string;
  minimumMinutes: number;
  queue: QueueStatus;
  itemsLeft: number;
  children?: ReactNode;
}) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const t = window.setInterval(() => setNow(Date.now()), 1000);
    return () => window.clearInterval(t);
  }, []);
  const elapsed = Math.max(0, now - new Date(startedAt).getTime());
  const short = elapsed < minimumMinutes * 60000;
  const sync = queue.offline
    ? { text: `Offline · ${queue.pending} saved on this phone`, tone: 'bg-minor text-ground' }
    : queue.serverAway
      ? { text: `Server away · ${queue.pending} saved on this phone`, tone: 'bg-minor text-ground' }
      : queue.pending > 0
        ? { text: `Sending ${queue.pending}…`, tone: 'bg-panel text-ink' }
        : { text: '✓ All saved', tone: 'bg-panel text-pass' };
  return (
    <div className="sticky top-0 z-10 border-b-slab border-edge bg-ground/95 px-3 py-2 backdrop-blur">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <p className="text-2xl font-extrabold" data-testid="zone-title">
          {capitalize(zoneName)}
        </p>
        <p className="text-lg text-muted">
          Zone {zoneNumber} of {zoneCount} · {itemsLeft} open
        </p>
      </div>
      <div className="mt-1 flex flex-wrap items-center justify-between gap-2 text-lg">
        <span className={short ? 'text-minor' : 'text-pass'}>
          Time {minutes(elapsed)} of {minimumMinutes} min
        </span>
        <span
          role="status"
          aria-live="polite"
          data-testid="sync-status"
          className={`rounded px-2 font-bold ${sync.tone}`}
        >
          {sync.text}
        </span>
      </div>
      {children}
    </div>
  );
}

export function PendingMatchPanel({
  pending,
  onYes,
  onNo,
  onPick,
  onNone,
}: {
  pending: PendingMatch;
  onYes: () => void;
  onNo: () => void;
  onPick: (termKey: string) => void;
  onNone: () => void;
}) {
  return (
    <section aria-label="Did you mean" className={`space-y-3 ${panelClass()}`}>
      <p className="text-lg text-muted">Heard: “{pending.heard}”</p>
      {!pending.declined ? (
        <>
          <p className="text-2xl font-extrabold">
            Did you mean {pending.top.position ? `${pending.top.position} ` : ''}
            {pending.top.component}, {pending.top.condition}?
          </p>
          <div className="grid grid-cols-2 gap-2">
            <Button tone="primary" onClick={onYes}>
              Yes
            </Button>
            <Button onClick={onNo}>No</Button>
          </div>
        </>
      ) : (
        <>
          <p className="text-2xl font-extrabold">Which one?</p>
          <div className="flex flex-col gap-2">
            {pending.others.slice(0, 4).map((a) => (
              <Button key={a.termId} onClick={() => onPick(a.termId)}>
                {a.component}, {a.condition}
              </Button>
            ))}
            <Button onClick={onNone}>None of these</Button>
          </div>
        </>
      )}
    </section>
  );
}

/** A one-minute count for the leakage tests, and a stopwatch for the build-up. */
export function AirTimer({ mode, onResult }: { mode: 'minute' | 'stopwatch'; onResult?: (seconds: number) => void }) {
  const [startedAt, setStartedAt] = useState<number | null>(null);
  const [now, setNow] = useState(0);
  useEffect(() => {
    if (startedAt === null) return;
    const t = window.setInterval(() => setNow(Date.now()), 250);
    return () => window.clearInterval(t);
  }, [startedAt]);
  const seconds = startedAt === null ? 0 : Math.max(0, Math.floor((now - startedAt) / 1000));
  if (mode === 'minute') {
    const left = Math.max(0, 60 - seconds);
    return startedAt === null ? (
      <Button onClick={() => (setStartedAt(Date.now()), setNow(Date.now()))}>Start the 1-minute timer</Button>
    ) : (
      <p
        className="flex min-h-target items-center justify-center rounded-lg border-slab border-edge text-3xl font-extrabold"
        role="timer"
      >
        {left > 0 ? `${left} s` : 'Time: read the gauge'}
      </p>
    );
  }
  return startedAt === null ? (
    <Button onClick={() => (setStartedAt(Date.now()), setNow(Date.now()))}>Start at 85 psi</Button>
  ) : (
    <Button
      tone="primary"
      onClick={() => {
        onResult?.(seconds);
        setStartedAt(null);
      }}
    >
      Stop at 100 psi · {seconds} s
    </Button>
  );
}

export function SealCheckPanel({ expected, lastHeard }: { expected: string; lastHeard: string | null }) {
  const [typed, setTyped] = useState('');
  const heard = typed || (lastHeard ? readSpokenSeal(lastHeard) : '');
  const result = heard ? compareSeal(expected, heard) : null;
  return (
    <section aria-label="Seal check" className={`space-y-2 ${panelClass()}`}>
      <p className="text-xl font-bold">
        Seal check: read the seal number aloud (say “seal” then the digits) or type it.
      </p>
      <input
        className={inputClass}
        inputMode="text"
        value={typed}
        onChange={(e) => setTyped(e.target.value)}
        aria-label="Seal number on the trailer"
      />
      {result &&
        (result.matches ? (
          <p className="text-xl font-bold text-pass" role="status">
            ✓ Seal {result.heard} matches the bill.
          </p>
        ) : (
          <p className="text-xl font-bold text-major" role="alert">
            ▲ Seal {result.heard || '—'} does not match {result.expected}: digit
            {result.wrongPositions.length > 1 ? 's' : ''} {result.wrongPositions.join(', ')}.
          </p>
        ))}
    </section>
  );
}

export function ReadingResult({ step }: { step: WalkStep | undefined }) {
  if (!step) return null;
  return (
    <>
      <ReadingVerdict step={step} />
      {step.phoneVerdict && (
        <p className="text-base font-bold" data-testid="server-verdict">
          ◆ RigCall’s server judged this reading{' '}
          {step.verdict === 'pass' ? 'a pass' : step.severity ? `a ${step.severity} defect` : 'a fail'}; this phone had
          said {step.phoneVerdict.verdict === 'pass' ? 'pass' : (step.phoneVerdict.severity ?? 'fail')}. The report
          carries the server’s verdict.
        </p>
      )}
    </>
  );
}

function ReadingVerdict({ step }: { step: WalkStep }) {
  const unit = step.limit?.split(' ').slice(1).join(' ') ?? '';
  const limit = step.limit ? formatReading(Number(step.limit.split(' ')[0]), unit) : null;
  if (step.verdict === 'pass')
    return (
      <p className="text-lg font-bold text-pass">
        ✓ Pass · {formatReading(step.reading?.value, unit)} {limit ? `(limit ${limit})` : ''}
      </p>
    );
  if (step.verdict === 'fail')
    return (
      <div className="space-y-1 text-lg">
        <p className="font-bold">
          {step.severity ? <SeverityMark severity={step.severity} /> : null} {formatReading(step.reading?.value, unit)}:
          fails the limit {limit ? `(${limit})` : ''}
        </p>
        {step.message && <p>{step.message}</p>}
        {step.source && <p className="text-base text-muted">Source: {step.source}</p>}
      </div>
    );
  return <p className="text-lg text-muted">Recorded {step.reading?.value}; no published limit applies here.</p>;
}

/** A button that listens while held down: for yards too loud for continuous listening. */
export function HoldToTalk({ onDown, onUp, disabled }: { onDown: () => void; onUp: () => void; disabled: boolean }) {
  const held = useRef(false);
  return (
    <button
      type="button"
      disabled={disabled}
      className="flex min-h-target w-full touch-none items-center justify-center rounded-lg border-slab border-edge bg-panel px-4 text-xl font-bold select-none active:bg-vest active:text-on-vest disabled:opacity-60"
      onPointerDown={(e) => {
        e.currentTarget.setPointerCapture(e.pointerId);
        held.current = true;
        onDown();
      }}
      onPointerUp={() => {
        if (held.current) onUp();
        held.current = false;
      }}
      onPointerCancel={() => {
        if (held.current) onUp();
        held.current = false;
      }}
    >
      Hold to talk
    </button>
  );
}

/** A pad to sign with a finger (gloves work on a pad this big); reports whether it holds ink. */
export function SignaturePad({
  onInk,
  canvasRef,
}: {
  onInk: (hasInk: boolean) => void;
  canvasRef: React.RefObject<HTMLCanvasElement | null>;
}) {
  const drawing = useRef(false);
  const pos = (e: React.PointerEvent<HTMLCanvasElement>) => {
    const r = e.currentTarget.getBoundingClientRect();
    return {
      x: ((e.clientX - r.left) * e.currentTarget.width) / r.width,
      y: ((e.clientY - r.top) * e.currentTarget.height) / r.height,
    };
  };
  const clear = () => {
    const c = canvasRef.current;
    c?.getContext('2d')?.clearRect(0, 0, c.width, c.height);
    onInk(false);
  };
  return (
    <div className="space-y-2">
      <canvas
        ref={canvasRef}
        width={900}
        height={320}
        aria-label="Draw your signature here"
        className="h-40 w-full touch-none rounded-lg border-slab border-edge bg-white"
        onPointerDown={(e) => {
          e.currentTarget.setPointerCapture(e.pointerId);
          drawing.current = true;
          const ctx = e.currentTarget.getContext('2d');
          if (!ctx) return;
          const p = pos(e);
          ctx.lineWidth = 6;
          ctx.lineCap = 'round';
          ctx.strokeStyle = '#14161a';
          ctx.beginPath();
          ctx.moveTo(p.x, p.y);
        }}
        onPointerMove={(e) => {
          if (!drawing.current) return;
          const ctx = e.currentTarget.getContext('2d');
          const p = pos(e);
          ctx?.lineTo(p.x, p.y);
          ctx?.stroke();
          onInk(true);
        }}
        onPointerUp={() => (drawing.current = false)}
        onPointerCancel={() => (drawing.current = false)}
      />
      <Button onClick={clear}>Clear the signature</Button>
    </div>
  );
}
