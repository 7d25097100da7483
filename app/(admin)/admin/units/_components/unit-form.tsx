'use client';

import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import type { z } from 'zod';
import { Field, FormNotice, inputClass, selectClass } from '@/components/ui/field';
import { useHydrated } from '@/components/ui/use-hydrated';
import { fieldsOfZod, firstError, numberOrNull, readFailure, type FieldErrors } from '@/components/admin/form-errors';
import { fleetSettingsQuery } from '@/lib/queries/admin';
import {
  axlePositions,
  brakeChamberTypes,
  createUnitBodySchema,
  plateJurisdictions,
  type UnitDto,
  type UnitKind,
} from '@/lib/schemas/units';
import { fromTemplate, layoutTemplates, makeAxle, removeAxle, tireLabels, type AxleDraft } from './axle-layout';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';

const fallbackTargets = { steer: 110, drive: 100, trailer: 100 };
const usCodes = plateJurisdictions.slice(0, 51);
const caCodes = plateJurisdictions.slice(51);

/** What the form hands to `onSave`: checked by the same schema the API uses. */
export type UnitFormBody = z.output<typeof createUnitBodySchema>;

function toBody(s: {
  unitNumber: string;
  plate: string;
  plateJurisdiction: string;
  vin: string;
  make: string;
  model: string;
  year: string;
  axles: AxleDraft[];
}) {
  return {
    unitNumber: s.unitNumber,
    plate: s.plate,
    plateJurisdiction: s.plateJurisdiction,
    vin: s.vin,
    make: s.make,
    model: s.model,
    year: numberOrNull(s.year),
    axles: s.axles.map((a) => ({
      position: a.position,
      tires: a.tires,
      coldPsi: numberOrNull(a.coldPsi),
      chamber: a.chamber,
    })),
  };
}

/**
 * The unit editor: identity, registration and the axle layout (cold-inflation target and brake
 * chamber type per axle). `onSave` gets a body the API accepts; its failures come back here.
 */
export function UnitForm({
  unit,
  readOnly = false,
  submitLabel,
  onSave,
}: {
  unit?: UnitDto;
  readOnly?: boolean;
  submitLabel: string;
  onSave: (body: UnitFormBody) => Promise<string>;
}) {
  const hydrated = useHydrated();
  const targets = useQuery(fleetSettingsQuery()).data?.tirePressureTargets ?? fallbackTargets;
  const [kind, setKind] = useState<UnitKind>(unit?.kind ?? 'tractor');
  const [unitNumber, setUnitNumber] = useState(unit?.unitNumber ?? '');
  const [plate, setPlate] = useState(unit?.plate ?? '');
  const [plateJurisdiction, setPlateJurisdiction] = useState(unit?.plateJurisdiction ?? '');
  const [vin, setVin] = useState(unit?.vin ?? '');
  const [make, setMake] = useState(unit?.make ?? '');
  const [model, setModel] = useState(unit?.model ?? '');
  const [year, setYear] = useState(unit?.year != null ? String(unit.year) : '');
  const [axles, setAxles] = useState<AxleDraft[]>(() =>
    unit
      ? unit.axles.map((a, i) =>
          makeAxle(a.position, i, targets, {
            tireCount: a.tires.length === 2 ? 2 : 4,
            tires: a.tires,
            coldPsi: String(a.coldPsi),
            chamber: a.chamber,
          }),
        )
      : fromTemplate(layoutTemplates[0]!, targets),
  );
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const err = (k: string) => firstError(errors, k);

  const setAxle = (i: number, change: Partial<AxleDraft>) =>
    setAxles((list) =>
      list.map((a, j) =>
        j === i
          ? {
              ...a,
              ...change,
              ...(change.tireCount || change.position
                ? { tires: tireLabels(change.position ?? a.position, i, change.tireCount ?? a.tireCount) }
                : {}),
            }
          : a,
      ),
    );

  function chooseKind(k: UnitKind) {
    setKind(k);
    setAxles(
      fromTemplate(
        layoutTemplates.find((t) => t.kind === k)!,
        targets,
      ),
    );
  }

  async function onSubmit(e: FormEvent) {
    e.preventDefault();
    setFailure(null);
    setSaved(null);
    const body = toBody({ unitNumber, plate, plateJurisdiction, vin, make, model, year, axles });
    const checked = createUnitBodySchema.safeParse({ kind, ...body });
    if (!checked.success) {
      setErrors(fieldsOfZod(checked.error));
      setFailure('Some fields need a fix; see the messages beside them.');
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      setSaved(await onSave(checked.data));
    } catch (error) {
      const f = readFailure(error);
      setErrors(f.fields);
      setFailure(f.message);
    }
    setBusy(false);
  }

  const positionsFor = kind === 'trailer' ? (['trailer'] as const) : axlePositions.filter((p) => p !== 'trailer');

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <fieldset disabled={readOnly} className="contents">
        <section
          className={`${panelClass({ padding: 'none' })} grid gap-4 p-4 md:grid-cols-4`}
          aria-labelledby="unit-identity"
        >
          <h2 id="unit-identity" className="text-xl font-extrabold md:col-span-4">
            The unit
          </h2>
          {unit ? null : (
            <fieldset className="md:col-span-4">
              <legend className="mb-1 text-base font-bold">Kind</legend>
              <div className="flex flex-wrap gap-2">
                {(['tractor', 'trailer'] as const).map((k) => (
                  <label
                    key={k}
                    className={`${buttonClass(kind === k ? 'primary' : 'plain', 'compact')} cursor-pointer has-[:focus-visible]:outline-4 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-vest`}
                  >
                    <input
                      type="radio"
                      name="kind"
                      value={k}
                      checked={kind === k}
                      onChange={() => chooseKind(k)}
                      className="sr-only"
                    />
                    {kind === k ? <span aria-hidden="true">●</span> : <span aria-hidden="true">○</span>}
                    {k === 'tractor' ? 'Tractor' : 'Trailer'}
                  </label>
                ))}
              </div>
            </fieldset>
          )}
          <Field id="unit-number" label="Unit number" error={err('unitNumber')} hint="As painted on the unit.">
            {(c) => (
              <input
                {...c}
                className={inputClass}
                value={unitNumber}
                onChange={(e) => setUnitNumber(e.target.value)}
                autoComplete="off"
              />
            )}
          </Field>
          <Field id="unit-make" label="Make" error={err('make')}>
            {(c) => <input {...c} className={inputClass} value={make} onChange={(e) => setMake(e.target.value)} />}
          </Field>
          <Field id="unit-model" label="Model" error={err('model')}>
            {(c) => <input {...c} className={inputClass} value={model} onChange={(e) => setModel(e.target.value)} />}
          </Field>
          <Field id="unit-year" label="Model year" error={err('year')}>
            {(c) => (
              <input
                {...c}
                className={inputClass}
                inputMode="numeric"
                value={year}
                onChange={(e) => setYear(e.target.value)}
              />
            )}
          </Field>
        </section>

        <section
          className={`${panelClass({ padding: 'none' })} grid gap-4 p-4 md:grid-cols-4`}
          aria-labelledby="unit-registration"
        >
          <h2 id="unit-registration" className="text-xl font-extrabold md:col-span-4">
            Registration
          </h2>
          <Field id="unit-plate" label="Plate" error={err('plate')}>
            {(c) => (
              <input
                {...c}
                className={`${inputClass} uppercase`}
                value={plate}
                onChange={(e) => setPlate(e.target.value)}
                autoComplete="off"
              />
            )}
          </Field>
          <Field id="unit-jurisdiction" label="Issued by" error={err('plateJurisdiction')} hint="State or province.">
            {(c) => (
              <select
                {...c}
                className={selectClass}
                value={plateJurisdiction}
                onChange={(e) => setPlateJurisdiction(e.target.value)}
              >
                <option value="">None</option>
                <optgroup label="United States">
                  {usCodes.map((j) => (
                    <option key={j}>{j}</option>
                  ))}
                </optgroup>
                <optgroup label="Canada">
                  {caCodes.map((j) => (
                    <option key={j}>{j}</option>
                  ))}
                </optgroup>
              </select>
            )}
          </Field>
          <Field
            id="unit-vin"
            label="VIN"
            error={err('vin')}
            hint="17 characters; never I, O or Q."
            className="md:col-span-2"
          >
            {(c) => (
              <input
                {...c}
                className={`${inputClass} font-mono tracking-wider uppercase`}
                value={vin}
                onChange={(e) => setVin(e.target.value)}
                maxLength={21}
                autoComplete="off"
                spellCheck={false}
              />
            )}
          </Field>
        </section>

        <section
          className={`${panelClass({ padding: 'none' })} flex flex-col gap-3 p-3 md:p-4`}
          aria-labelledby="unit-axles"
        >
          <div className="flex flex-wrap items-end justify-between gap-2">
            <div>
              <h2 id="unit-axles" className="text-xl font-extrabold">
                Axles, front to back
              </h2>
              <p className="text-base text-muted">
                Cold-inflation target and brake chamber type for each axle. New axles start at the fleet&apos;s default
                pressures.
              </p>
            </div>
            {readOnly ? null : (
              <div className="flex flex-wrap items-center gap-2">
                <span className="text-base font-bold">Start over from:</span>
                {layoutTemplates
                  .filter((t) => t.kind === kind)
                  .map((t) => (
                    <button
                      key={t.label}
                      type="button"
                      className={buttonClass('plain', 'compact')}
                      onClick={() => setAxles(fromTemplate(t, targets))}
                    >
                      {t.label}
                    </button>
                  ))}
              </div>
            )}
          </div>
          {err('axles') ? <FormNotice kind="error">{err('axles')}</FormNotice> : null}
          <ol className="flex flex-col gap-2">
            {axles.map((a, i) => (
              <li
                key={a.key}
                className="grid grid-cols-2 items-start gap-3 rounded-md border-2 border-edge/40 p-2 md:grid-cols-[4rem_repeat(4,minmax(0,1fr))_auto] md:p-3"
              >
                <p className="col-span-2 self-center text-lg font-extrabold md:col-span-1">Axle {i + 1}</p>
                <Field id={`axle-${i}-position`} label="Position" error={err(`axles.${i}.position`)}>
                  {(c) => (
                    <select
                      {...c}
                      className={selectClass}
                      value={a.position}
                      onChange={(e) => setAxle(i, { position: e.target.value as AxleDraft['position'] })}
                    >
                      {positionsFor.map((p) => (
                        <option key={p} value={p}>
                          {p === 'steer' ? 'Steer' : p === 'drive' ? 'Drive' : 'Trailer'}
                        </option>
                      ))}
                    </select>
                  )}
                </Field>
                <Field id={`axle-${i}-tires`} label="Tires" error={err(`axles.${i}.tires`)}>
                  {(c) => (
                    <select
                      {...c}
                      className={selectClass}
                      value={a.tireCount}
                      onChange={(e) => setAxle(i, { tireCount: e.target.value === '2' ? 2 : 4 })}
                    >
                      <option value={2}>2 singles</option>
                      <option value={4}>4 duals</option>
                    </select>
                  )}
                </Field>
                <Field id={`axle-${i}-psi`} label="Cold target, psi" error={err(`axles.${i}.coldPsi`)}>
                  {(c) => (
                    <input
                      {...c}
                      className={inputClass}
                      inputMode="numeric"
                      value={a.coldPsi}
                      onChange={(e) => setAxle(i, { coldPsi: e.target.value })}
                    />
                  )}
                </Field>
                <Field id={`axle-${i}-chamber`} label="Chamber type" error={err(`axles.${i}.chamber`)}>
                  {(c) => (
                    <select
                      {...c}
                      className={selectClass}
                      value={a.chamber}
                      onChange={(e) => setAxle(i, { chamber: e.target.value as AxleDraft['chamber'] })}
                    >
                      <option value="">Pick…</option>
                      {brakeChamberTypes.map((t) => (
                        <option key={t} value={t}>
                          {t}
                        </option>
                      ))}
                    </select>
                  )}
                </Field>
                {readOnly ? null : (
                  <button
                    type="button"
                    className={`${buttonClass('plain', 'compact')} col-span-2 md:col-span-1 md:mt-7`}
                    aria-label={`Remove axle ${i + 1}`}
                    disabled={axles.length === 1}
                    onClick={() => setAxles((list) => removeAxle(list, i))}
                  >
                    Remove
                  </button>
                )}
              </li>
            ))}
          </ol>
          {readOnly || axles.length >= 6 ? null : (
            <button
              type="button"
              className={`${buttonClass('plain', 'compact')} self-start`}
              onClick={() =>
                setAxles((list) => [...list, makeAxle(kind === 'trailer' ? 'trailer' : 'drive', list.length, targets)])
              }
            >
              + Add an axle
            </button>
          )}
        </section>
      </fieldset>

      {failure ? <FormNotice kind="error">{failure}</FormNotice> : null}
      {saved ? <FormNotice kind="saved">{saved}</FormNotice> : null}
      {readOnly ? null : (
        <div>
          <button
            type="submit"
            className={`${buttonClass('primary', 'compact')} min-w-60`}
            disabled={busy || !hydrated}
          >
            {busy ? 'Saving…' : submitLabel}
          </button>
        </div>
      )}
    </form>
  );
}
