'use client';

import { useQuery, useQueryClient } from '@tanstack/react-query';
import Link from 'next/link';
import { useState } from 'react';
import { kindLabel, zoneLabel } from '@/components/office/format';
import { TimeStamp } from '@/components/ui/time-stamp';
import {
  countWords,
  formatLimitText,
  formatQuantity,
  idWords,
  nameFinding,
  sourceWords,
  tidyText,
} from '@/lib/walk/name-finding';
import { useHydrated } from '@/components/ui/use-hydrated';
import { SafetyCautions } from '@/components/office/safety-cautions';
import { Button, buttonClass } from '@/components/ui/button';
import { Field, FieldError } from '@/components/ui/field';
import { Panel } from '@/components/ui/panel';
import { SeverityMark } from '@/components/ui/severity-mark';
import { UnitStatus } from '@/components/ui/unit-status';
import { ApiError, fetchJson } from '@/lib/http/fetch-json';
import { defectDetailOptions, useCertifyRepairMutation } from '@/lib/queries/defects';
import { repairCertificationStatement } from '@/lib/schemas/defects';

const input = 'w-full rounded-md border-2 border-edge/60 bg-ground p-2 text-base aria-[invalid=true]:border-major';

export function DefectClient({
  id,
  userName,
  canCertify,
  canOpenReport,
}: {
  id: string;
  userName: string;
  canCertify: boolean;
  /** The whole report is a supervisor's page: linked only for those who can open it. */
  canOpenReport: boolean;
}) {
  const { data: d } = useQuery(defectDetailOptions(id));
  const certify = useCertifyRepairMutation(id);
  const [outcome, setOutcome] = useState<'repaired' | 'no_repair_needed'>('repaired');
  const [work, setWork] = useState('');
  const [parts, setParts] = useState('');
  const [notes, setNotes] = useState('');
  const [name, setName] = useState(userName);
  const [confirm, setConfirm] = useState(false);
  const [together, setTogether] = useState<string[]>([]);
  const live = useHydrated();
  const queryClient = useQueryClient();
  const [photoState, setPhotoState] = useState<string | null>(null);
  const addRepairPhoto = async (file: File) => {
    setPhotoState('Sending the photo…');
    try {
      await fetchJson(`/api/defects/${id}/photos/${crypto.randomUUID()}`, {
        method: 'PUT',
        body: file,
        headers: { 'content-type': file.type || 'application/octet-stream' },
      });
      setPhotoState('Photo added.');
      await queryClient.invalidateQueries({ queryKey: defectDetailOptions(id).queryKey });
    } catch (e) {
      setPhotoState(e instanceof ApiError ? e.message : 'The photo could not be sent.');
    }
  };
  if (!d) return <p>Loading the defect…</p>;
  const fields: Record<string, string[]> = certify.error instanceof ApiError ? (certify.error.fields ?? {}) : {};
  const fieldError = (k: string) => fields[k]?.join(' ');

  return (
    <article className="space-y-5">
      <Link href="/mechanic" className="text-base font-bold underline-offset-2 hover:underline">
        ← Open defects
      </Link>
      <Panel as="header" className={`space-y-2 ${d.severity === 'major' ? 'border-l-[12px] border-l-major' : ''}`}>
        <SeverityMark severity={d.severity} />
        <h1 className="text-3xl font-extrabold">{d.description}</h1>
        <p className="flex flex-wrap items-center gap-3 text-lg">
          <span className="font-bold">
            Unit {d.unitNumber}{' '}
            <span className="font-normal text-muted">
              ({d.unitKind}
              {d.unitMake ? `, ${d.unitMake} ${d.unitModel ?? ''}` : ''})
            </span>
          </span>
          <UnitStatus status={d.unitStatus} />
        </p>
        <dl className="grid grid-cols-2 gap-3 text-base md:grid-cols-4">
          <div>
            <dt className="text-sm font-bold text-muted uppercase">Found</dt>
            <dd>
              {kindLabel(d.inspectionKind)}, <TimeStamp iso={d.inspectedAt} timeZone={d.timezone} />
            </dd>
          </div>
          <div>
            <dt className="text-sm font-bold text-muted uppercase">Driver</dt>
            <dd>{d.driverName}</dd>
          </div>
          <div>
            <dt className="text-sm font-bold text-muted uppercase">Where</dt>
            <dd>
              <span className="capitalize">{zoneLabel(d.zone)}</span> ·{' '}
              {nameFinding({ component: d.component, condition: d.condition, position: d.position })}
            </dd>
          </div>
          <div>
            <dt className="text-sm font-bold text-muted uppercase">Said</dt>
            <dd>{d.finding.heard ? <q>{d.finding.heard}</q> : 'tapped'}</dd>
          </div>
          {d.finding.measurementKind && (
            <div className="col-span-2">
              <dt className="text-sm font-bold text-muted uppercase">Measured</dt>
              <dd>
                {formatQuantity(d.finding.value, d.finding.unit)} ({idWords(d.finding.measurementKind)}); limit{' '}
                {formatLimitText(d.finding.limitText)}; {sourceWords(d.finding.source)}
              </dd>
            </div>
          )}
        </dl>
        {canOpenReport && (
          <p className="text-sm">
            <Link href={`/supervisor/reports/${d.inspectionId}`} className="underline">
              The whole report
            </Link>
          </p>
        )}
        {(['driver', 'mechanic'] as const).map((who) => {
          const shown = d.photos.filter((p) => p.takenBy === who);
          if (!shown.length) return null;
          const title = who === 'driver' ? "Driver's photos of the finding" : 'Repair photos';
          return (
            <figure key={who} className="space-y-1" data-testid={`photos-${who}`}>
              <figcaption className="text-sm font-bold text-muted uppercase">
                {title} · {shown.length}
              </figcaption>
              <div className="flex flex-wrap gap-2">
                {shown.map((p) => (
                  <a key={p.id} href={p.url} target="_blank" rel="noreferrer" className="relative">
                    {/* eslint-disable-next-line @next/next/no-img-element */}
                    <img
                      src={`${p.url}?size=thumb`}
                      alt={`${who === 'driver' ? "Driver's photo" : 'Repair photo'} of ${d.component}`}
                      className={`h-28 w-36 rounded object-cover ${who === 'driver' ? 'border-2 border-edge' : 'border-4 border-pass'}`}
                    />
                    <span
                      className={`absolute bottom-1 left-1 rounded px-1.5 text-xs font-bold ${who === 'driver' ? 'bg-edge text-ground' : 'bg-pass text-white'}`}
                    >
                      {who === 'driver' ? 'DRIVER' : 'REPAIR'}
                    </span>
                  </a>
                ))}
              </div>
            </figure>
          );
        })}
        {canCertify && (
          <div className="flex flex-wrap items-center gap-3">
            <label
              className={`${buttonClass('plain', 'touch')} cursor-pointer has-[:focus-visible]:outline-4 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-vest`}
            >
              Add a repair photo
              <input
                type="file"
                accept="image/*"
                capture="environment"
                className="sr-only"
                disabled={!live}
                onChange={(e) => (
                  e.target.files?.[0] ? void addRepairPhoto(e.target.files[0]) : undefined,
                  (e.target.value = '')
                )}
              />
            </label>
            {photoState && (
              <span role="status" className="text-base" data-testid="repair-photo-status">
                {photoState}
              </span>
            )}
          </div>
        )}
      </Panel>

      {certify.data && (
        <p role="status" className="rounded border-2 border-pass p-2 text-lg font-bold" data-testid="certify-result">
          {certify.data.certifiedIds.length > 1
            ? `Certified ${countWords(certify.data.certifiedIds.length, 'defect')} in one work order`
            : 'Certified'}
          . Unit {certify.data.unit.unitNumber} is{' '}
          {certify.data.unit.status === 'in_service' ? 'in service' : 'still OUT OF SERVICE'}
          {certify.data.openMajor > 0 ? ` (${countWords(certify.data.openMajor, 'major defect')} still open)` : ''}
          {certify.data.unit.changed && certify.data.mailed ? '; maintenance and the supervisor were mailed.' : '.'}
        </p>
      )}
      {d.certification ? (
        <Panel as="section" tone="pass" aria-labelledby="cert-heading" data-testid="certification">
          <h2 id="cert-heading" className="text-xl font-extrabold">
            <SeverityMark
              severity="pass"
              label={d.status === 'repaired' ? 'Repaired and certified' : 'No repair needed, certified'}
            />
          </h2>
          <p className="text-lg">
            {d.certification.name}, <TimeStamp iso={d.certification.at} timeZone={d.timezone} />
          </p>
          {d.repair.work && <p>Work: {d.repair.work}</p>}
          {d.repair.parts && <p>Parts: {d.repair.parts}</p>}
          {d.repair.notes && <p>Notes: {d.repair.notes}</p>}
          <p className="mt-2 text-muted italic">&ldquo;{d.certification.text}&rdquo;</p>
        </Panel>
      ) : (
        <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
          <Panel
            as="form"
            aria-label="Repair and certification"
            className="space-y-4"
            onSubmit={(e) => {
              e.preventDefault();
              certify.mutate({
                outcome,
                work,
                parts,
                notes,
                certifiedName: name,
                confirm: confirm as true,
                togetherWith: together,
              });
            }}
          >
            <h2 className="text-xl font-extrabold">Repair</h2>
            <Field id="repair-work" label="Work done" error={fieldError('work')}>
              {(control) => (
                <textarea
                  {...control}
                  className={input}
                  rows={3}
                  value={work}
                  onChange={(e) => setWork(e.target.value)}
                  placeholder="What you did, or what you checked"
                />
              )}
            </Field>
            <Field id="repair-parts" label="Parts" error={fieldError('parts')}>
              {(control) => (
                <input
                  {...control}
                  className={input}
                  value={parts}
                  onChange={(e) => setParts(e.target.value)}
                  placeholder="Part numbers, or none"
                />
              )}
            </Field>
            <Field id="repair-notes" label="Notes" error={fieldError('notes')}>
              {(control) => (
                <textarea
                  {...control}
                  className={input}
                  rows={2}
                  value={notes}
                  onChange={(e) => setNotes(e.target.value)}
                />
              )}
            </Field>
            {d.unitOpenDefects.length > 0 && (
              <fieldset className="space-y-2" data-testid="work-order">
                <legend className="text-xl font-extrabold">Work order</legend>
                <p className="text-base text-muted">
                  Unit {d.unitNumber} has {countWords(d.unitOpenDefects.length, 'other open defect')}. Tick those this
                  repair and signature cover; leave them to certify one by one.
                </p>
                {d.unitOpenDefects.map((o) => (
                  <label
                    key={o.id}
                    className="flex min-h-target cursor-pointer items-center gap-3 rounded-lg border-2 border-edge/30 px-3 py-2 text-base"
                  >
                    <input
                      type="checkbox"
                      checked={together.includes(o.id)}
                      onChange={(e) =>
                        setTogether((t) => (e.target.checked ? [...t, o.id] : t.filter((x) => x !== o.id)))
                      }
                      className="size-7 shrink-0"
                    />
                    <SeverityMark severity={o.severity} compact />
                    <span>{tidyText(o.description)}</span>
                  </label>
                ))}
                <Button
                  type="button"
                  size="compact"
                  onClick={() =>
                    setTogether(together.length === d.unitOpenDefects.length ? [] : d.unitOpenDefects.map((o) => o.id))
                  }
                >
                  {together.length === d.unitOpenDefects.length ? 'Untick all' : 'Tick all'}
                </Button>
              </fieldset>
            )}
            <fieldset className="space-y-2">
              <legend className="text-xl font-extrabold">Certification</legend>
              {(['repaired', 'no_repair_needed'] as const).map((o) => (
                <label
                  key={o}
                  className={`flex min-h-target cursor-pointer items-center gap-3 rounded-lg border-slab px-4 text-lg font-bold ${outcome === o ? 'border-edge bg-ground' : 'border-edge/30'}`}
                >
                  <input
                    type="radio"
                    name="outcome"
                    value={o}
                    checked={outcome === o}
                    onChange={() => setOutcome(o)}
                    className="h-6 w-6"
                  />
                  {o === 'repaired' ? 'Repaired' : 'No repair needed'}
                </label>
              ))}
              <Field id="repair-signature" label="Your full name (signature)" error={fieldError('certifiedName')}>
                {(control) => (
                  <input
                    {...control}
                    className={input}
                    value={name}
                    onChange={(e) => setName(e.target.value)}
                    autoComplete="name"
                  />
                )}
              </Field>
              <label className="flex min-h-target cursor-pointer items-start gap-3 rounded-lg border-2 border-edge/30 px-3 py-2 text-base">
                <input
                  type="checkbox"
                  checked={confirm}
                  onChange={(e) => setConfirm(e.target.checked)}
                  className="mt-0.5 size-7 shrink-0"
                />
                <span>{repairCertificationStatement[outcome]} The time of signing is recorded.</span>
              </label>
              {fieldError('confirm') ? <FieldError message={fieldError('confirm') ?? ''} /> : null}
            </fieldset>
            {certify.error && !Object.keys(fields).length && (
              <p role="alert" className="font-bold text-major">
                {certify.error.message}
              </p>
            )}
            {canCertify ? (
              <Button type="submit" tone="primary" disabled={!live || certify.isPending}>
                {certify.isPending ? 'Signing…' : 'Sign the certification'}
              </Button>
            ) : (
              <p className="text-muted">Only a mechanic signs a repair certification.</p>
            )}
          </Panel>
          <SafetyCautions />
        </div>
      )}
    </article>
  );
}
