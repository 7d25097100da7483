import 'server-only';
import { sql } from 'kysely';
import { getDb, type DB } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { findInspectionForUpdate, findStep, stepColumns } from '@/lib/db/inspections';
import { findFleetUnit } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import { buildCheckInput, measureUnit, type CheckContext } from '@/lib/inspection/build-check';
import { evaluateMeasurement } from '@/lib/rules';
import type { Zones } from '@/lib/schemas/grammar';
import type { recordStepBodySchema } from '@/lib/schemas/inspections';
import type { z } from 'zod';
import { recordAudit } from './record-audit';
import { loadGrammar, resolveTerm } from './resolve-vocabulary';

type Body = z.output<typeof recordStepBodySchema>;
const itemsOf = (zones: Zones) => new Map(zones.zones.flatMap((z) => z.items.map((i) => [i.id, i] as const)));

/** What the rules need about the units of this inspection. */
export async function loadCheckContext(db: DB, i: { fleetId: string; tractorId: string; trailerId: string | null }): Promise<CheckContext> {
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
  };
}

/**
 * Record one step of a walk. The id comes from the device: the same step sent twice is recorded
 * once, even after the report is locked. The server judges readings and finds severities itself.
 */
export async function recordStep({ fleetId, actorId, inspectionId, body }: { fleetId: string; actorId: string; inspectionId: string; body: Body }) {
  const outcome = await writeStep({ fleetId, actorId, inspectionId, body });
  if ('refused' in outcome) {
    // Logged outside the refused write, so the attempt stays on record.
    await recordAudit(getDb(), { fleetId, actorId, action: 'inspection.change_refused', entity: 'inspection', entityId: inspectionId, detail: { stepId: body.id, kind: body.kind } });
    throw new AppError('conflict', 'This report is signed and locked; it cannot change.');
  }
  return outcome;
}

async function writeStep({ fleetId, actorId, inspectionId, body }: { fleetId: string; actorId: string; inspectionId: string; body: Body }) {
  return getDb()
    .transaction()
    .execute(async (trx) => {
      // A step of an open walk commits without waiting for the disk: the phone keeps every step
      // until the report is signed, signing names them all and is refused while one is missing,
      // and the signing commit does wait, which makes every earlier step durable with it.
      // (A step replayed after the lock changes nothing, so this costs nothing there.)
      await sql`set local synchronous_commit = off`.execute(trx);
      const inspection = await findInspectionForUpdate(trx, { fleetId, id: inspectionId });
      if (!inspection) throw new AppError('not_found', 'No such inspection in your fleet.');
      if (inspection.driverId !== actorId) throw new AppError('forbidden', 'Only the driver who started this inspection records its steps.');
      if (inspection.status === 'submitted') {
        // A replay of a step the report already holds is harmless; anything new is refused.
        const already = await findStep(trx, { inspectionId, id: body.id });
        return already ? { step: already, created: false } : { refused: true as const };
      }
      if (body.undoesStepId) {
        const target = await findStep(trx, { inspectionId, id: body.undoesStepId });
        if (!target) throw new AppError('invalid_body', 'The step to take back is not part of this inspection.', { undoesStepId: ['not part of this inspection'] });
      }

      let component: string | null = null;
      let condition: string | null = null;
      let severity: 'minor' | 'major' | null = null;
      let source: string | null = null;
      let verdict: 'pass' | 'fail' | null = null;
      let limitText: string | null = null;
      let measurementKind: string | null = null;
      let value: number | null = null;
      let unit: string | null = null;

      const grammar = await loadGrammar(trx, inspection.vocabularyVersionId);
      if (body.termKey) {
        const vocab = grammar.vocabulary;
        const term = resolveTerm(vocab, body.termKey, inspection.ruleProfile);
        if (!term) throw new AppError('invalid_body', `“${body.termKey}” is not in this inspection’s vocabulary.`, { termKey: ['not in the vocabulary'] });
        component = term.component;
        condition = term.condition;
        if (body.kind === 'defect') {
          severity = term.severity;
          source = term.source;
        }
      }
      if (body.kind === 'measurement' && body.reading && body.item) {
        const item = itemsOf(grammar.zones).get(body.item);
        if (!item?.measure) throw new AppError('invalid_body', `“${body.item}” is not a checklist item that takes a reading.`, { item: ['not a measured item'] });
        measurementKind = item.measure;
        component = grammar.vocabulary.components.find((c) => c.id === item.component)?.name ?? item.label;
        value = body.reading.value;
        unit = measureUnit[item.measure];
        const input = buildCheckInput(item, body.reading, await loadCheckContext(trx, inspection));
        if (input) {
          const outcome = evaluateMeasurement(input, { profile: inspection.ruleProfile });
          if ('error' in outcome) throw new AppError('invalid_body', `That reading cannot be judged: ${outcome.error}.`, { reading: [outcome.error] });
          measurementKind = outcome.check;
          verdict = outcome.verdict;
          severity = outcome.severity;
          source = outcome.source;
          limitText = outcome.limit === null ? null : `${outcome.limit} ${outcome.unit}`;
        }
      }

      const step = await trx
        .insertInto('inspectionStep')
        .values({
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
          component,
          condition,
          position: body.position,
          score: body.score,
          resolution: body.resolution,
          undoesStepId: body.undoesStepId,
          measurementKind,
          value,
          unit,
          verdict,
          severity,
          limitText,
          source,
          deviceAt: new Date(body.deviceAt),
        })
        .onConflict((oc) => oc.column('id').doNothing())
        .returning(stepColumns)
        .executeTakeFirst();
      if (step && body.inputMode === 'voice' && body.heard) {
        // What the vocabulary missed or half-caught goes to the trainers' inbox.
        const outcome = body.kind === 'note' ? 'unmatched' : body.resolution === 'corrected' ? 'corrected' : body.resolution === 'confirmed' ? 'low_score' : null;
        if (outcome) {
          await trx
            .insertInto('fieldUtterance')
            .values({ fleetId, stepId: step.id, zone: body.zone, text: body.heard, normalized: body.heard.toLowerCase().replace(/[^a-z0-9' ]+/g, ' ').replace(/\s+/g, ' ').trim(), outcome, termKey: body.termKey, score: body.score })
            .execute();
        }
      }
      if (step) return { step, created: true };
      // Sent before (a replay after a reconnect): return what was recorded the first time.
      const recorded = await findStep(trx, { inspectionId, id: body.id });
      if (!recorded) throw new AppError('conflict', 'That step id is already used by another inspection.');
      return { step: recorded, created: false };
    });
}
