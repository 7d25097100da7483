import 'server-only';
import { sql } from 'kysely';
import { getStepDb, type DB } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { findInspectionForUpdate, findStep, stepColumns } from '@/lib/db/inspections';
import { findFleetUnit } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import type { Zones } from '@/lib/schemas/grammar';
import {
  checkDeviceTime,
  judgeReading,
  measureUnit,
  QUEUED_OFFLINE_AFTER_MS,
  resolveTerm,
  stepFingerprint,
  type CheckContext,
  type StepBody,
} from '@/lib/walk';
import { loadGrammar } from '../vocabulary/resolve-vocabulary';
import { refuseLockedChange } from './refuse-locked-change';

// Durability. An open walk's steps are written on getStepDb, whose commits do not wait for the
// disk: a database crash can lose the last fraction of a second of them after the phone was told
// they were saved. The phone keeps every step until the report is signed; signing names them
// all and is refused while the server lacks one (the phone then sends it again), and the
// signing commit waits for the disk, which makes every earlier step durable with it.

type Body = StepBody;
type Inspection = {
  fleetId: string;
  startedAt: Date;
  tractorId: string;
  trailerId: string | null;
  ruleProfile: string;
  vocabularyVersionId: string | null;
};
const itemsOf = (zones: Zones) => new Map(zones.zones.flatMap((z) => z.items.map((i) => [i.id, i] as const)));

/** What the rules need about the units of this inspection. */
export async function loadCheckContext(
  db: DB,
  i: { fleetId: string; tractorId: string; trailerId: string | null },
): Promise<CheckContext> {
  const [tractor, trailer, fleet] = await Promise.all([
    findFleetUnit(db, { fleetId: i.fleetId, id: i.tractorId }),
    i.trailerId ? findFleetUnit(db, { fleetId: i.fleetId, id: i.trailerId }) : Promise.resolve(undefined),
    findFleetSettings(db, { fleetId: i.fleetId }),
  ]);
  return {
    tractorAxles: tractor?.axles ?? [],
    trailerAxles: trailer?.axles ?? [],
    hasTrailer: !!i.trailerId,
    trailerYear: trailer?.year ?? null,
    fleetTargets: fleet?.tirePressureTargets ?? { steer: 110, drive: 100, trailer: 100 },
    tirePressureTolerancePsi: fleet?.tirePressureTolerancePsi,
  };
}

// What an inspection was started with never changes: its units, rule profile and vocabulary.
// Kept per process, so that a walk's later steps need not read the inspection first.
const startedWith = new Map<string, Inspection>();
const rememberInspection = (i: Inspection & { id: string }) => {
  if (startedWith.size >= 5000) startedWith.delete(startedWith.keys().next().value!);
  startedWith.set(`${i.fleetId}:${i.id}`, {
    fleetId: i.fleetId,
    startedAt: i.startedAt,
    tractorId: i.tractorId,
    trailerId: i.trailerId,
    ruleProfile: i.ruleProfile,
    vocabularyVersionId: i.vocabularyVersionId,
  });
};

/** The trainers' inbox takes what the vocabulary missed or half-caught. */
const utteranceOutcome = (body: Body) =>
  body.inputMode !== 'voice' || !body.heard
    ? null
    : body.kind === 'note'
      ? 'unmatched'
      : body.resolution === 'corrected'
        ? 'corrected'
        : body.resolution === 'confirmed'
          ? 'low_score'
          : null;

/** The step's words and judgement, worked out on the server from the inspection's own vocabulary and units. */
async function judgeStep(db: DB, inspection: Inspection, body: Body) {
  const judged = {
    component: null as string | null,
    condition: null as string | null,
    severity: null as 'minor' | 'major' | null,
    source: null as string | null,
    verdict: null as 'pass' | 'fail' | null,
    limitText: null as string | null,
    measurementKind: null as string | null,
    value: null as number | null,
    unit: null as string | null,
  };
  const grammar = await loadGrammar(db, inspection.vocabularyVersionId);
  if (body.termKey) {
    const term = resolveTerm(grammar.vocabulary, body.termKey, inspection.ruleProfile);
    if (!term)
      throw new AppError('invalid_body', `“${body.termKey}” is not in this inspection’s vocabulary.`, {
        termKey: ['not in the vocabulary'],
      });
    judged.component = term.component;
    judged.condition = term.condition;
    if (body.kind === 'defect') {
      judged.severity = term.severity;
      judged.source = term.source;
    }
  }
  if (body.item && (body.kind === 'ok' || body.kind === 'not_checked') && !itemsOf(grammar.zones).has(body.item))
    throw new AppError('invalid_body', `“${body.item}” is not an item of this inspection’s checklist.`, {
      item: ['not a checklist item'],
    });
  if (body.kind === 'ok' && body.item && itemsOf(grammar.zones).get(body.item)?.measure)
    throw new AppError('invalid_body', 'An item that needs a reading is answered by the number or by “not checked”.', {
      item: ['needs a reading'],
    });
  if (body.kind === 'measurement' && body.reading && body.item) {
    const item = itemsOf(grammar.zones).get(body.item);
    if (!item?.measure)
      throw new AppError('invalid_body', `“${body.item}” is not a checklist item that takes a reading.`, {
        item: ['not a measured item'],
      });
    judged.measurementKind = item.measure;
    judged.component = grammar.vocabulary.components.find((c) => c.id === item.component)?.name ?? item.label;
    judged.value = body.reading.value;
    judged.unit = measureUnit[item.measure];
    const verdict = judgeReading(item, body.reading, await loadCheckContext(db, inspection), inspection.ruleProfile);
    if (!verdict.judged && verdict.error)
      throw new AppError('invalid_body', `That reading cannot be judged: ${verdict.error}.`, {
        reading: [verdict.error],
      });
    if (verdict.judged) {
      const outcome = verdict.result;
      judged.measurementKind = outcome.check;
      judged.verdict = outcome.verdict;
      judged.severity = outcome.severity;
      judged.source = outcome.source;
      judged.limitText = outcome.limit === null ? null : `${outcome.limit} ${outcome.unit}`;
    }
  }
  return judged;
}

const stepRow = (fleetId: string, inspectionId: string, body: Body, judged: Awaited<ReturnType<typeof judgeStep>>) => ({
  id: body.id,
  fleetId,
  inspectionId,
  seq: body.seq,
  zone: body.zone,
  item: body.item,
  kind: body.kind,
  heard: body.heard,
  alternatives: JSON.stringify(body.alternatives),
  inputMode: body.inputMode,
  termKey: body.termKey,
  position: body.position,
  score: body.score,
  resolution: body.resolution,
  undoesStepId: body.undoesStepId,
  notCheckedReason: body.kind === 'not_checked' ? body.notCheckedReason : null,
  note: body.kind === 'not_checked' ? body.note : null,
  deviceAt: new Date(body.deviceAt),
  // Heard long after the phone recorded it: it waited on the phone, and its device time counts.
  queuedOffline: Date.now() - new Date(body.deviceAt).getTime() > QUEUED_OFFLINE_AFTER_MS,
  ...judged,
});

/** A replay must say what the first send said; the same id with other content is refused. */
function sameStepOrConflict(recorded: Awaited<ReturnType<typeof findStep>> & object, body: Body) {
  const sent = stepFingerprint({ ...body, value: body.reading?.value ?? null });
  const held = stepFingerprint({ ...recorded, value: recorded.value === null ? null : Number(recorded.value) });
  if (sent !== held)
    throw new AppError(
      'conflict',
      `Step ${body.id} is already recorded with other content (${recorded.kind}${recorded.item ? ` of ${recorded.item}` : ''} in ${recorded.zone}); a step id names one step only. Send the new entry with a new id.`,
      { id: ['already used for another step'] },
    );
  return recorded;
}

/**
 * Record one step of a walk. The id comes from the device: the same step sent twice is recorded
 * once, even after the report is locked. The server judges readings and finds severities itself.
 */
export async function recordStep({
  fleetId,
  actorId,
  inspectionId,
  body,
}: {
  fleetId: string;
  actorId: string;
  inspectionId: string;
  body: Body;
}) {
  const known = startedWith.get(`${fleetId}:${inspectionId}`);
  if (known) refuseImplausibleTime(body, known.startedAt);
  const quick = await writeStepQuickly({ fleetId, actorId, inspectionId, body });
  if (quick) return { step: quick, created: true };
  const outcome = await writeStep({ fleetId, actorId, inspectionId, body });
  if ('refused' in outcome) {
    throw await refuseLockedChange(
      { fleetId, actorId, inspectionId },
      { stepId: body.id, kind: body.kind },
      'This report is signed and locked; it cannot change.',
    );
  }
  return outcome;
}

function refuseImplausibleTime(body: Body, startedAt: Date) {
  const problem = checkDeviceTime(body.deviceAt, { now: new Date(), startedAt, what: 'step' });
  if (problem) throw new AppError('invalid_body', problem, { deviceAt: [problem] });
}

const snake = (s: string) => s.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

/**
 * The common case in one statement: a new plain step of an open walk this process has seen
 * before. The row is written only while the inspection is this driver's and not signed; the
 * inspection row is share-locked for it, so signing (which locks it for update) waits for the
 * step or the step for the signing, never both half-way. Anything else (the first step of a walk,
 * a reading, a take-back, a phrase for the trainers, a replay, a refusal) returns null and goes
 * the careful way.
 */
async function writeStepQuickly({
  fleetId,
  actorId,
  inspectionId,
  body,
}: {
  fleetId: string;
  actorId: string;
  inspectionId: string;
  body: Body;
}) {
  const inspection = startedWith.get(`${fleetId}:${inspectionId}`);
  if (!inspection || body.kind === 'measurement' || body.undoesStepId || utteranceOutcome(body)) return null;
  const db = getStepDb();
  const row = stepRow(fleetId, inspectionId, body, await judgeStep(db, inspection, body));
  const columns = Object.keys(row).map(snake);
  const record = Object.fromEntries(
    Object.entries(row).map(([k, v]) => [snake(k), k === 'alternatives' ? body.alternatives : v]),
  );
  const result = await sql<Record<(typeof stepColumns)[number], unknown>>`
    with live as (
      select id from inspection
      where id = ${inspectionId} and fleet_id = ${fleetId} and driver_id = ${actorId} and status <> 'submitted'
      for key share
    )
    insert into inspection_step (${sql.join(columns.map((c) => sql.ref(c)))})
    select ${sql.join(columns.map((c) => sql.ref(`r.${c}`)))}
    from live, json_populate_record(null::inspection_step, ${JSON.stringify(record)}::json) r
    on conflict (id) do nothing
    returning ${sql.join(stepColumns.map((c) => sql.ref(snake(c))))}`.execute(db);
  return (result.rows[0] as Awaited<ReturnType<typeof findStep>>) ?? null;
}

async function writeStep({
  fleetId,
  actorId,
  inspectionId,
  body,
}: {
  fleetId: string;
  actorId: string;
  inspectionId: string;
  body: Body;
}) {
  return getStepDb()
    .transaction()
    .execute(async (trx) => {
      const inspection = await findInspectionForUpdate(trx, { fleetId, id: inspectionId });
      if (!inspection) throw new AppError('not_found', 'No such inspection in your fleet.');
      if (inspection.driverId !== actorId)
        throw new AppError('forbidden', 'Only the driver who started this inspection records its steps.');
      if (inspection.status === 'submitted') {
        // A replay of a step the report already holds is harmless; anything new is refused.
        const already = await findStep(trx, { inspectionId, id: body.id });
        return already ? { step: sameStepOrConflict(already, body), created: false } : { refused: true as const };
      }
      refuseImplausibleTime(body, inspection.startedAt);
      rememberInspection(inspection);
      if (body.undoesStepId) {
        const target = await findStep(trx, { inspectionId, id: body.undoesStepId });
        if (!target)
          throw new AppError('invalid_body', 'The step to take back is not part of this inspection.', {
            undoesStepId: ['not part of this inspection'],
          });
      }
      const step = await trx
        .insertInto('inspectionStep')
        .values(stepRow(fleetId, inspectionId, body, await judgeStep(trx, inspection, body)))
        .onConflict((oc) => oc.column('id').doNothing())
        .returning(stepColumns)
        .executeTakeFirst();
      const outcome = utteranceOutcome(body);
      if (step && outcome && body.heard) {
        await trx
          .insertInto('fieldUtterance')
          .values({
            fleetId,
            stepId: step.id,
            zone: body.zone,
            text: body.heard,
            normalized: body.heard
              .toLowerCase()
              .replace(/[^a-z0-9' ]+/g, ' ')
              .replace(/\s+/g, ' ')
              .trim(),
            outcome,
            termKey: body.termKey,
            score: body.score,
          })
          .execute();
      }
      if (step) return { step, created: true };
      // Sent before (a replay after a reconnect): return what was recorded the first time.
      const recorded = await findStep(trx, { inspectionId, id: body.id });
      if (!recorded) throw new AppError('conflict', 'That step id is already used by another inspection.');
      return { step: sameStepOrConflict(recorded, body), created: false };
    });
}
