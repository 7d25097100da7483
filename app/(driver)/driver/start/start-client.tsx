'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { slabInputClass } from '@/components/ui/field';
import { Panel } from '@/components/ui/panel';
import { SeverityMark } from '@/components/ui/severity-mark';
import { UnitStatus } from '@/components/ui/unit-status';
import { ApiError, fetchJson } from '@/lib/http/fetch-json';

type UnitChoice = { id: string; unitNumber: string; status: string; label: string };
type ReviewDefect = {
  id: string;
  component: string;
  condition: string;
  position: string | null;
  severity: string;
  description: string;
  status: string;
  repairWork: string | null;
  certifiedName: string | null;
  certifiedAt: string | null;
};
type Review = {
  unitId: string;
  mustAcknowledge: boolean;
  mayOperate: boolean;
  uncertified: number;
  report: { id: string; kind: string; finishedAt: string; driverName: string; defects: ReviewDefect[] } | null;
};

const choice = (on: boolean) =>
  `flex min-h-target flex-col items-start justify-center rounded-lg border-slab px-4 py-2 text-left ${on ? 'border-edge bg-vest text-on-vest' : 'border-edge bg-panel text-ink'}`;

function UnitPicker({
  legend,
  units,
  value,
  onPick,
  allowNone,
}: {
  legend: string;
  units: UnitChoice[];
  value: string | null;
  onPick: (id: string | null) => void;
  allowNone?: boolean;
}) {
  return (
    <fieldset className="space-y-2">
      <legend className="text-xl font-bold">{legend}</legend>
      <div className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        {units.map((u) => (
          <button
            key={u.id}
            type="button"
            aria-pressed={value === u.id}
            className={choice(value === u.id)}
            onClick={() => onPick(u.id)}
          >
            <span className="text-2xl font-extrabold">{u.unitNumber}</span>
            {u.status === 'out_of_service' ? (
              <UnitStatus status="out_of_service" />
            ) : (
              <span className="text-base">{u.label}</span>
            )}
          </button>
        ))}
        {allowNone && (
          <button
            type="button"
            aria-pressed={value === null}
            className={choice(value === null)}
            onClick={() => onPick(null)}
          >
            <span className="text-xl font-extrabold">No trailer</span>
            <span className="text-base">tractor alone</span>
          </button>
        )}
      </div>
    </fieldset>
  );
}

function ReviewPanel({
  unitNumber,
  review,
  driverName,
  onSigned,
}: {
  unitNumber: string;
  review: Review;
  driverName: string;
  onSigned: () => void;
}) {
  const [name, setName] = useState('');
  const [error, setError] = useState<string | null>(null);
  const report = review.report!;
  async function sign() {
    setError(null);
    try {
      await fetchJson('/api/acknowledgements', {
        method: 'POST',
        json: { id: crypto.randomUUID(), unitId: review.unitId, reviewedInspectionId: report.id, signatureName: name },
      });
      onSigned();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not sign the review.');
    }
  }
  return (
    <Panel as="section" className="space-y-3" aria-label={`Last report of unit ${unitNumber}`}>
      <h2 className="text-2xl font-extrabold">Review the last report of unit {unitNumber}</h2>
      <p className="text-lg">
        {report.kind === 'pre_trip' ? 'Pre-trip' : 'Post-trip'} by {report.driverName},{' '}
        {new Date(report.finishedAt).toLocaleString()}.
      </p>
      <ul className="space-y-2">
        {report.defects.map((d) => (
          <Panel as="li" key={d.id} padding="sm" className="text-lg">
            <p className="font-bold">
              <SeverityMark severity={d.severity === 'major' ? 'major' : 'minor'} className="mr-2" />
              {d.description}
            </p>
            {d.status === 'open' ? (
              <p className="font-bold text-major">▲ Not certified yet: no repair recorded.</p>
            ) : (
              <p className="text-pass">
                ✓ {d.status === 'repaired' ? 'Repaired' : 'No repair needed'}, certified by {d.certifiedName}{' '}
                {d.certifiedAt ? new Date(d.certifiedAt).toLocaleString() : ''}
                {d.repairWork ? `: ${d.repairWork}` : ''}
              </p>
            )}
          </Panel>
        ))}
      </ul>
      {!review.mayOperate && (
        <p role="alert" className="rounded-lg bg-major p-3 text-lg font-bold text-on-major">
          ■ Do not drive this unit until every defect above is certified repaired or not needing repair (49 CFR 396.13).
        </p>
      )}
      <label className="flex flex-col gap-2 text-lg font-bold">
        Type your name to sign that you reviewed this report
        <input
          className={slabInputClass}
          value={name}
          onChange={(e) => setName(e.target.value)}
          placeholder={driverName}
          autoComplete="name"
        />
      </label>
      {error && (
        <p role="alert" className="text-lg font-bold text-major">
          ▲ {error}
        </p>
      )}
      <Button tone="primary" onClick={() => void sign()} disabled={name.trim().length < 2}>
        I reviewed it — sign
      </Button>
    </Panel>
  );
}

export function StartClient({
  kind: initialKind,
  driverName,
  tractors,
  trailers,
}: {
  kind: 'pre_trip' | 'post_trip';
  driverName: string;
  tractors: UnitChoice[];
  trailers: UnitChoice[];
}) {
  const router = useRouter();
  const [kind, setKind] = useState(initialKind);
  const [tractorId, setTractorId] = useState<string | null>(null);
  const [trailerId, setTrailerId] = useState<string | null>(null);
  const [odometer, setOdometer] = useState('');
  const [location, setLocation] = useState('');
  const [billOfLading, setBillOfLading] = useState('');
  const [sealNumber, setSealNumber] = useState('');
  const [reviews, setReviews] = useState<Review[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const unitNumber = (id: string) => [...tractors, ...trailers].find((u) => u.id === id)?.unitNumber ?? '';

  async function checkReviews() {
    if (!tractorId) return setError('Pick the tractor first.');
    setError(null);
    setBusy(true);
    try {
      const ids = [tractorId, trailerId].filter((x): x is string => !!x);
      const found = await Promise.all(
        ids.map((id) => fetchJson<{ review: Review }>(`/api/units/${id}/review`).then((r) => r.review)),
      );
      setReviews(found);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not load the last reports.');
    }
    setBusy(false);
  }

  async function start() {
    setError(null);
    setBusy(true);
    const id = crypto.randomUUID();
    try {
      await fetchJson('/api/inspections', {
        method: 'POST',
        json: {
          id,
          kind,
          tractorId,
          trailerId,
          odometer: odometer ? Number(odometer) : null,
          location,
          billOfLading,
          sealNumber: trailerId ? sealNumber : '',
          startedAt: new Date().toISOString(),
        },
      });
      router.push(`/driver/inspections/${id}/walk`);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not start the inspection.');
      setBusy(false);
    }
  }

  const pendingReviews = (reviews ?? []).filter((r) => r.mustAcknowledge && r.report);
  return (
    <div className="flex flex-col gap-6 pb-10">
      <div className="grid grid-cols-2 gap-2" role="group" aria-label="Inspection type">
        {(['pre_trip', 'post_trip'] as const).map((k) => (
          <button
            key={k}
            type="button"
            aria-pressed={kind === k}
            className={choice(kind === k)}
            onClick={() => setKind(k)}
          >
            <span className="text-xl font-extrabold">{k === 'pre_trip' ? 'Pre-trip' : 'Post-trip'}</span>
          </button>
        ))}
      </div>
      <UnitPicker
        legend="Tractor"
        units={tractors}
        value={tractorId}
        onPick={(id) => (setTractorId(id), setReviews(null))}
      />
      <UnitPicker
        legend="Trailer"
        units={trailers}
        value={trailerId}
        onPick={(id) => (setTrailerId(id), setReviews(null))}
        allowNone
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <label className="flex flex-col gap-2 text-lg font-bold">
          Odometer
          <input
            className={slabInputClass}
            inputMode="numeric"
            pattern="[0-9]*"
            value={odometer}
            onChange={(e) => setOdometer(e.target.value.replace(/\D/g, ''))}
          />
        </label>
        <label className="flex flex-col gap-2 text-lg font-bold">
          Location (optional)
          <input className={slabInputClass} value={location} onChange={(e) => setLocation(e.target.value)} />
        </label>
        {trailerId && (
          <>
            <label className="flex flex-col gap-2 text-lg font-bold">
              Bill of lading (optional)
              <input
                className={slabInputClass}
                value={billOfLading}
                onChange={(e) => setBillOfLading(e.target.value)}
              />
            </label>
            <label className="flex flex-col gap-2 text-lg font-bold">
              Seal number (optional)
              <input className={slabInputClass} value={sealNumber} onChange={(e) => setSealNumber(e.target.value)} />
            </label>
          </>
        )}
      </div>
      {error && (
        <Panel as="p" role="alert" tone="major" className="text-lg font-bold text-major">
          ▲ {error}
        </Panel>
      )}
      {reviews === null ? (
        <Button tone="primary" onClick={() => void checkReviews()} disabled={busy || !tractorId}>
          Continue
        </Button>
      ) : pendingReviews.length > 0 ? (
        pendingReviews.map((r) => (
          <ReviewPanel
            key={r.unitId}
            unitNumber={unitNumber(r.unitId)}
            review={r}
            driverName={driverName}
            onSigned={() =>
              setReviews((all) =>
                (all ?? []).map((x) => (x.unitId === r.unitId ? { ...x, mustAcknowledge: false } : x)),
              )
            }
          />
        ))
      ) : (
        <Button tone="primary" onClick={() => void start()} disabled={busy}>
          {busy ? 'Starting…' : `Start the walk · ${kind === 'pre_trip' ? 'pre-trip' : 'post-trip'}`}
        </Button>
      )}
    </div>
  );
}
