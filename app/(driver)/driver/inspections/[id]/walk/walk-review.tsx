'use client';
// Review and sign: what the report will say, the items still open (tap one to go there), the
// certification, the typed name and the drawn signature. Signing waits until nothing is open.
import Link from 'next/link';
import { useEffect, useRef, useState } from 'react';
import { useStore } from 'zustand';
import { Button, buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { SeverityMark } from '@/components/ui/severity-mark';
import { deviceQueue, dropFailedRequest, enqueueRequest } from '@/lib/inspection/device-queue';
import { planResend } from '@/lib/inspection/resend-missing';
import type { WalkStore } from '@/lib/inspection/store';
import type { useFlushQueue } from '@/lib/inspection/use-flush-queue';
import { checkInspectionDuration } from '@/lib/rules';
import type { MeasureKind } from '@/lib/schemas/grammar';
import {
  certificationStatement,
  listDefectSteps,
  listOpenItems,
  listVisitedZones,
  mapItemAnswers,
  type InspectionKind,
  type WalkZone,
} from '@/lib/walk';
import { enqueueStep } from './enqueue-step';
import { formatReading, inputClass, SignaturePad } from './walk-parts';

export function ReviewAndSign({
  store,
  queue,
  inspection,
  zones,
  requiredReadings,
  minimumMinutes,
  tractorNumber,
  trailerNumber,
  driverName,
  onGoTo,
}: {
  store: WalkStore;
  queue: ReturnType<typeof useFlushQueue>;
  inspection: { id: string; kind: InspectionKind; status: 'draft' | 'submitted'; startedAt: string };
  zones: WalkZone[];
  requiredReadings: readonly MeasureKind[];
  minimumMinutes: number;
  tractorNumber: string;
  trailerNumber: string | null;
  driverName: string;
  /** Back to the walk, at this zone and item. */
  onGoTo: (zoneIndex: number, itemId: string) => void;
}) {
  const steps = useStore(store, (s) => s.steps);
  const phase = useStore(store, (s) => s.phase);
  const signedName = useStore(store, (s) => s.signedName);
  const [name, setName] = useState('');
  const [certified, setCertified] = useState(false);
  const [finishedAt] = useState(() => new Date().toISOString());
  const defects = listDefectSteps(steps);
  const answers = mapItemAnswers(zones, steps);
  const visited = listVisitedZones(steps);
  const open = listOpenItems(zones, steps, { kind: inspection.kind, requiredReadings });
  const notChecked = zones.flatMap((z) =>
    z.items.filter((i) => answers.get(i.id) === 'not_checked').map((i) => ({ zone: z.name, label: i.label })),
  );
  const duration = checkInspectionDuration(
    inspection.startedAt,
    phase === 'signed' ? finishedAt : new Date().toISOString(),
    { minimumPretripMinutes: minimumMinutes },
  );
  const majors = defects.filter((d) => d.severity !== 'minor');
  const [signedClickAt, setSignedClickAt] = useState<number | null>(null);
  // Locked on the server: known from the page, or the outbox emptied after the signature went in.
  const sent =
    inspection.status === 'submitted' ||
    (phase === 'signed' &&
      signedClickAt !== null &&
      (queue.lastSentAt ?? 0) >= signedClickAt &&
      queue.pending === 0 &&
      queue.failed.length === 0);

  const pad = useRef<HTMLCanvasElement | null>(null);
  const [inked, setInked] = useState(false);
  const finishUrl = `/api/inspections/${inspection.id}/finish`;
  const sign = async () => {
    setSignedClickAt(Date.now());
    const drawn = await new Promise<Blob | null>((resolve) =>
      pad.current ? pad.current.toBlob(resolve, 'image/png') : resolve(null),
    );
    // The drawn signature goes first; the outbox keeps the order, online or not.
    if (drawn)
      await enqueueRequest({
        label: 'drawn signature',
        url: `/api/inspections/${inspection.id}/signature`,
        method: 'PUT',
        blob: drawn,
      });
    // The signature names every step on this phone, so that the server cannot lock a report short of one.
    const stepIds = store.getState().steps.map((s) => s.id);
    await enqueueRequest({
      label: 'signature',
      url: finishUrl,
      method: 'POST',
      json: { signatureName: name, certify: true, finishedAt: new Date().toISOString(), stepIds },
    });
    store.getState().setPhase('signed', name);
  };

  // Signing refused because the server lacks steps: send them again from this phone, then sign again.
  const refusedKeys = queue.failed.map((f) => f.key).join(',');
  const resending = useRef(false);
  // Sent again as often as it helps, and the server still lacks steps: say so, not "sending again".
  const [stillMissing, setStillMissing] = useState(false);
  useEffect(() => {
    if (!refusedKeys || resending.current) return;
    resending.current = true;
    void (async () => {
      try {
        const outbox = await deviceQueue.list();
        const plan = planResend({ outbox, steps: store.getState().steps, finishUrl });
        setStillMissing(
          !plan && outbox.some((r) => r.url === finishUrl && r.state === 'failed' && !!r.errorFields?.stepIds),
        );
        if (!plan) return;
        await dropFailedRequest(plan.dropKey);
        for (const step of plan.steps) await enqueueStep(inspection.id, step);
        await enqueueRequest({
          label: 'signature',
          url: finishUrl,
          method: 'POST',
          json: plan.finishJson,
          resendRound: plan.round,
        });
      } finally {
        resending.current = false;
      }
    })();
  }, [refusedKeys, store, finishUrl, inspection.id]);

  return (
    <div className="flex flex-col gap-4 pb-10">
      <h1 className="text-3xl font-extrabold">{phase === 'signed' ? 'Signed' : 'Review and sign'}</h1>
      <div className="grid grid-cols-3 gap-2 text-center">
        <p className={panelClass({ padding: 'sm' })}>
          <span className="block text-3xl font-extrabold">{majors.length}</span> major
        </p>
        <p className={panelClass({ padding: 'sm' })}>
          <span className="block text-3xl font-extrabold">{defects.length - majors.length}</span> minor
        </p>
        <p className={panelClass({ padding: 'sm' })}>
          <span className="block text-3xl font-extrabold" data-testid="open-count">
            {open.length}
          </span>{' '}
          open
        </p>
      </div>
      <p className={`text-xl ${duration.short ? 'font-bold text-minor' : 'text-pass'}`}>
        {duration.short ? '△' : '✓'} {Math.round(duration.minutes)} min spent · fleet minimum {duration.minimumMinutes}{' '}
        min{duration.short ? ': shorter than the minimum' : ''}
      </p>
      <p className="text-lg">
        {visited.size} of {zones.length} zones visited.
      </p>
      {majors.length > 0 && (
        <p role="alert" className="rounded-lg bg-major p-3 text-xl font-extrabold text-on-major">
          ■ OUT OF SERVICE: a major defect keeps unit {tractorNumber}
          {trailerNumber ? ` / ${trailerNumber}` : ''} off the road until a mechanic certifies the repair.
        </p>
      )}
      <ul className="space-y-2" aria-label="Defects">
        {defects.map((d) => (
          <li key={d.id} className={`${panelClass({ padding: 'sm' })} text-lg`}>
            <SeverityMark severity={d.severity ?? 'major'} /> {d.label}
            {d.kind === 'measurement' && d.limit
              ? ` (limit ${formatReading(Number(d.limit.split(' ')[0]), d.limit.split(' ').slice(1).join(' '))})`
              : ''}
          </li>
        ))}
      </ul>
      {phase !== 'signed' && open.length > 0 && (
        <section aria-label="Open items" className={`space-y-2 ${panelClass({ padding: 'sm', tone: 'major' })}`}>
          <p className="text-xl font-bold" role="alert">
            ▲ {open.length === 1 ? 'One item is' : `${open.length} items are`} still open. Answer each (OK, defect, a
            reading, or not checked with a reason) before signing. Tap one to go there.
          </p>
          <ul className="grid gap-2">
            {open.map((o) => (
              <li key={o.item}>
                <Button onClick={() => onGoTo(o.zoneIndex, o.item)}>
                  {o.zoneName}: {o.label}
                  {o.reading ? ' (reading)' : ''}
                </Button>
              </li>
            ))}
          </ul>
        </section>
      )}
      {notChecked.length > 0 && (
        <details className={`${panelClass({ padding: 'sm' })} text-lg`}>
          <summary className="min-h-target cursor-pointer content-center font-bold">
            Not checked, with a reason ({notChecked.length})
          </summary>
          <ul className="list-disc pl-6">
            {notChecked.map((u) => (
              <li key={`${u.zone}-${u.label}`}>
                {u.zone}: {u.label}
              </li>
            ))}
          </ul>
        </details>
      )}
      {phase === 'signed' ? (
        <div className="space-y-3">
          <p className="text-xl">Signed by {signedName}.</p>
          <p role="status" data-testid="signed-status" className="text-xl font-bold">
            {sent
              ? '✓ Report locked on RigCall’s server.'
              : stillMissing
                ? '▲ Not locked: RigCall’s server still lacks steps from this phone. Keep this phone and tell the office.'
                : queue.failed.length
                  ? `▲ ${queue.failed[0]!.error}`
                  : `Saved on this phone; sending ${queue.pending}…`}
          </p>
          <Link href="/driver" className={buttonClass('primary')}>
            Done
          </Link>
        </div>
      ) : (
        <>
          <Button onClick={() => store.getState().setPhase('walking')}>◀ Back to the walk</Button>
          <label className="flex min-h-target items-center gap-3 rounded-lg border-slab border-edge bg-panel p-3 text-lg">
            <input
              type="checkbox"
              className="size-8 shrink-0"
              checked={certified}
              onChange={(e) => setCertified(e.target.checked)}
            />
            {certificationStatement}
          </label>
          <label className="flex flex-col gap-2 text-lg font-bold">
            Type your full name to sign
            <input
              className={inputClass}
              value={name}
              onChange={(e) => setName(e.target.value)}
              placeholder={driverName}
              autoComplete="name"
            />
          </label>
          <p className="text-lg font-bold">Sign with your finger</p>
          <SignaturePad canvasRef={pad} onInk={setInked} />
          <Button
            tone="primary"
            disabled={open.length > 0 || !certified || name.trim().length < 2 || !inked}
            onClick={() => void sign()}
          >
            Sign and lock the report
          </Button>
        </>
      )}
    </div>
  );
}
