'use client';

import { useState, type FormEvent, type ReactNode } from 'react';
import { Field, FormNotice, inputClass } from '@/components/ui/field';
import { useHydrated } from '@/components/ui/use-hydrated';
import { fieldsOfZod, firstError, numberOrNull, readFailure, type FieldErrors } from '@/components/admin/form-errors';
import { useUpdateFleetSettingsMutation } from '@/lib/queries/admin';
import {
  fleetTimeZones,
  ruleProfileLabel,
  ruleProfiles,
  updateFleetSettingsBodySchema,
  type FleetSettings,
  type RuleProfile,
} from '@/lib/schemas/fleet';
import { buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { measureKindSchema, type MeasureKind } from '@/lib/schemas/grammar';

const measureKindLabel: Record<MeasureKind, string> = {
  tread_depth: 'Tread depth',
  tire_pressure: 'Tire pressure',
  pushrod_stroke: 'Pushrod stroke',
  low_air_warning: 'Low-air warning',
  air_buildup: 'Air pressure build-up time',
  governor_cutout: 'Governor cut-out',
  governor_cutin: 'Governor cut-in',
  air_leak: 'Air leakage (released and applied)',
  steering_lash: 'Steering wheel lash',
  fifth_wheel_movement: 'Coupler movement',
  ground_clearance: 'Rear impact guard clearance',
};

const timeFormat = new Intl.DateTimeFormat('en-US', { hour: 'numeric', minute: '2-digit' });

/** "America/Chicago (CST, UTC−6)": the name and what it reads now. */
function zoneOption(zone: string): string {
  const now = new Date();
  const name = (style: 'short' | 'longOffset') =>
    new Intl.DateTimeFormat('en-US', { timeZone: zone, timeZoneName: style })
      .formatToParts(now)
      .find((p) => p.type === 'timeZoneName')?.value ?? '';
  return `${zone.replace(/_/g, ' ')} (${name('short')}, ${name('longOffset').replace('GMT', 'UTC')})`;
}

function Suffixed({ suffix, children }: { suffix: string; children: ReactNode }) {
  return (
    <div className="flex items-center gap-2">
      <div className="w-28">{children}</div>
      <span className="text-lg text-muted">{suffix}</span>
    </div>
  );
}

export function SettingsForm({ fleet }: { fleet: FleetSettings }) {
  const hydrated = useHydrated();
  const save = useUpdateFleetSettingsMutation();
  const [pre, setPre] = useState(String(fleet.minPretripMinutes));
  const [post, setPost] = useState(String(fleet.minPosttripMinutes));
  const [steer, setSteer] = useState(String(fleet.tirePressureTargets.steer));
  const [drive, setDrive] = useState(String(fleet.tirePressureTargets.drive));
  const [trailer, setTrailer] = useState(String(fleet.tirePressureTargets.trailer));
  const [tolerance, setTolerance] = useState(String(fleet.tirePressureTolerancePsi));
  const [required, setRequired] = useState<MeasureKind[]>(fleet.requiredReadings);
  const [profile, setProfile] = useState<RuleProfile>(fleet.ruleProfile);
  const [timezone, setTimezone] = useState(fleet.timezone);
  const [maintenanceEmail, setMaintenanceEmail] = useState(fleet.maintenanceEmail ?? '');
  const [supervisorEmail, setSupervisorEmail] = useState(fleet.supervisorEmail ?? '');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [savedAt, setSavedAt] = useState<Date | null>(null);
  const err = (k: string) => firstError(errors, k);

  async function onSubmit(e: FormEvent) {
    e.preventDefault();
    setFailure(null);
    setSavedAt(null);
    const body = {
      minPretripMinutes: numberOrNull(pre),
      minPosttripMinutes: numberOrNull(post),
      tirePressureTargets: { steer: numberOrNull(steer), drive: numberOrNull(drive), trailer: numberOrNull(trailer) },
      tirePressureTolerancePsi: numberOrNull(tolerance),
      requiredReadings: required,
      ruleProfile: profile,
      timezone,
      maintenanceEmail,
      supervisorEmail,
    };
    const checked = updateFleetSettingsBodySchema.safeParse(body);
    if (!checked.success) {
      setErrors(fieldsOfZod(checked.error));
      setFailure('Some settings need a fix; see the messages beside them.');
      return;
    }
    setErrors({});
    try {
      await save.mutateAsync(checked.data);
      setSavedAt(new Date());
    } catch (error) {
      const f = readFailure(error);
      setErrors(f.fields);
      setFailure(f.message);
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="grid items-start gap-5 lg:grid-cols-2">
      <section aria-labelledby="times-heading" className={`${panelClass({ padding: 'none' })} flex flex-col gap-4 p-4`}>
        <h2 id="times-heading" className="text-xl font-extrabold">
          Minimum inspection time
        </h2>
        <p className="text-base text-muted">
          A walk-around finished faster than this is flagged as short on the report and for the supervisor. No
          regulation sets a number; 15 minutes for a pre-trip is common practice.
        </p>
        <Field
          id="min-pretrip"
          label="Pre-trip"
          error={err('minPretripMinutes')}
          hint="0 to 240 minutes; 0 turns the check off."
        >
          {(c) => (
            <Suffixed suffix="minutes">
              <input
                {...c}
                className={inputClass}
                inputMode="numeric"
                value={pre}
                onChange={(e) => setPre(e.target.value)}
              />
            </Suffixed>
          )}
        </Field>
        <Field id="min-posttrip" label="Post-trip" error={err('minPosttripMinutes')} hint="0 to 240 minutes.">
          {(c) => (
            <Suffixed suffix="minutes">
              <input
                {...c}
                className={inputClass}
                inputMode="numeric"
                value={post}
                onChange={(e) => setPost(e.target.value)}
              />
            </Suffixed>
          )}
        </Field>
      </section>

      <section aria-labelledby="tires-heading" className={`${panelClass({ padding: 'none' })} flex flex-col gap-4 p-4`}>
        <h2 id="tires-heading" className="text-xl font-extrabold">
          Default cold-inflation targets
        </h2>
        <p className="text-base text-muted">
          The starting target for each axle of a new unit. A unit&apos;s own axle targets win over these.
        </p>
        <div className="grid gap-4 sm:grid-cols-3">
          <Field id="psi-steer" label="Steer" error={err('tirePressureTargets.steer')}>
            {(c) => (
              <Suffixed suffix="psi">
                <input
                  {...c}
                  className={inputClass}
                  inputMode="numeric"
                  value={steer}
                  onChange={(e) => setSteer(e.target.value)}
                />
              </Suffixed>
            )}
          </Field>
          <Field id="psi-drive" label="Drive" error={err('tirePressureTargets.drive')}>
            {(c) => (
              <Suffixed suffix="psi">
                <input
                  {...c}
                  className={inputClass}
                  inputMode="numeric"
                  value={drive}
                  onChange={(e) => setDrive(e.target.value)}
                />
              </Suffixed>
            )}
          </Field>
          <Field id="psi-trailer" label="Trailer" error={err('tirePressureTargets.trailer')}>
            {(c) => (
              <Suffixed suffix="psi">
                <input
                  {...c}
                  className={inputClass}
                  inputMode="numeric"
                  value={trailer}
                  onChange={(e) => setTrailer(e.target.value)}
                />
              </Suffixed>
            )}
          </Field>
        </div>
        <Field
          id="psi-tolerance"
          label="Gauge tolerance"
          error={err('tirePressureTolerancePsi')}
          hint="A reading this far under the target still counts as on target. 2 psi is about what a tire gauge can be trusted to (common practice, no published source); 0 to 10."
        >
          {(c) => (
            <Suffixed suffix="psi">
              <input
                {...c}
                className={inputClass}
                inputMode="numeric"
                value={tolerance}
                onChange={(e) => setTolerance(e.target.value)}
              />
            </Suffixed>
          )}
        </Field>
      </section>

      <section
        aria-labelledby="readings-heading"
        className={`${panelClass({ padding: 'none' })} flex flex-col gap-3 p-4`}
      >
        <h2 id="readings-heading" className="text-xl font-extrabold">
          Required readings
        </h2>
        <p className="text-base text-muted">
          A pre-trip cannot be signed until each of these has a number, or is marked not checked with a reason. The
          others may be read or left out. By default: the air-brake tests.
        </p>
        <fieldset className="grid gap-2 sm:grid-cols-2">
          <legend className="sr-only">Required readings</legend>
          {measureKindSchema.options.map((m) => (
            <label key={m} className="flex min-h-12 cursor-pointer items-center gap-3 text-lg">
              <input
                type="checkbox"
                className="size-6"
                checked={required.includes(m)}
                onChange={(e) => setRequired((r) => (e.target.checked ? [...r, m] : r.filter((x) => x !== m)))}
              />
              {measureKindLabel[m]}
            </label>
          ))}
        </fieldset>
      </section>

      <section
        aria-labelledby="profile-heading"
        className={`${panelClass({ padding: 'none' })} flex flex-col gap-3 p-4`}
      >
        <h2 id="profile-heading" className="text-xl font-extrabold">
          Rule profile
        </h2>
        <p className="text-base text-muted">
          The published limits measurements are judged against, and which defects put a unit out of service.
        </p>
        <fieldset className="flex flex-col gap-2" aria-describedby={err('ruleProfile') ? 'profile-error' : undefined}>
          <legend className="sr-only">Rule profile</legend>
          {ruleProfiles.map((p) => (
            <label
              key={p}
              className={`flex min-h-12 cursor-pointer items-center gap-3 rounded-md border-slab px-3 py-2 text-lg ${profile === p ? 'border-edge bg-ground font-bold' : 'border-edge/30'}`}
            >
              <input
                type="radio"
                name="rule-profile"
                value={p}
                checked={profile === p}
                onChange={() => setProfile(p)}
                className="size-5 accent-[rgb(var(--ink))]"
              />
              {ruleProfileLabel[p]}
            </label>
          ))}
          {err('ruleProfile') ? (
            <p id="profile-error" className="text-base font-bold text-major">
              ▲ {err('ruleProfile')}
            </p>
          ) : null}
        </fieldset>
      </section>

      <section aria-labelledby="zone-heading" className={`${panelClass({ padding: 'none' })} flex flex-col gap-4 p-4`}>
        <h2 id="zone-heading" className="text-xl font-extrabold">
          Time zone
        </h2>
        <p className="text-base text-muted">
          Every time on the office screens, the PDF and the mails is shown in this zone, with the viewer&apos;s own
          clock beside it when it reads differently. Exports carry the offset.
        </p>
        <Field id="fleet-timezone" label="Fleet time zone" error={err('timezone')}>
          {(c) => (
            <select {...c} className={inputClass} value={timezone} onChange={(e) => setTimezone(e.target.value)}>
              {[...new Set<string>([timezone, ...fleetTimeZones])].map((z) => (
                <option key={z} value={z}>
                  {zoneOption(z)}
                </option>
              ))}
            </select>
          )}
        </Field>
      </section>

      <section aria-labelledby="mail-heading" className={`${panelClass({ padding: 'none' })} flex flex-col gap-4 p-4`}>
        <h2 id="mail-heading" className="text-xl font-extrabold">
          Where alerts go
        </h2>
        <p className="text-base text-muted">
          A major defect e-mails both addresses. Leave one empty to send nothing there.
        </p>
        <Field id="maintenance-email" label="Maintenance e-mail" error={err('maintenanceEmail')}>
          {(c) => (
            <input
              {...c}
              type="email"
              inputMode="email"
              className={inputClass}
              value={maintenanceEmail}
              onChange={(e) => setMaintenanceEmail(e.target.value)}
            />
          )}
        </Field>
        <Field id="supervisor-email" label="Supervisor e-mail" error={err('supervisorEmail')}>
          {(c) => (
            <input
              {...c}
              type="email"
              inputMode="email"
              className={inputClass}
              value={supervisorEmail}
              onChange={(e) => setSupervisorEmail(e.target.value)}
            />
          )}
        </Field>
      </section>

      <div className="flex flex-col gap-3 lg:col-span-2">
        {failure ? <FormNotice kind="error">{failure}</FormNotice> : null}
        {savedAt ? <FormNotice kind="saved">Settings saved at {timeFormat.format(savedAt)}.</FormNotice> : null}
        <div>
          <button
            type="submit"
            className={`${buttonClass('primary', 'compact')} min-w-60`}
            disabled={save.isPending || !hydrated}
          >
            {save.isPending ? 'Saving…' : 'Save settings'}
          </button>
        </div>
      </div>
    </form>
  );
}
