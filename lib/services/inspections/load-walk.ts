import 'server-only';
import type { DB } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { listInspectionSteps } from '@/lib/db/inspections';
import { findFleetUnit } from '@/lib/db/units';
import { findVocabularyVersion, getDefaultGrammar } from '@/lib/db/vocabulary';
import type { WalkStep } from '@/lib/inspection/store';
import { configurationOf, DEFAULT_REQUIRED_READINGS, listWalkZones } from '@/lib/walk';
import { z } from 'zod';
import { loadCheckContext } from './record-step';

const uuid = z.uuid();

/** Everything the walk screen needs for one of the driver's own inspections, or null. */
export async function loadWalkOrNull(
  db: DB,
  { fleetId, driverId, inspectionId }: { fleetId: string; driverId: string; inspectionId: string },
) {
  if (!uuid.safeParse(inspectionId).success) return null;
  const inspection = await db
    .selectFrom('inspection')
    .select([
      'id',
      'kind',
      'status',
      'tractorId',
      'trailerId',
      'startedAt',
      'sealNumber',
      'ruleProfile',
      'driverId',
      'vocabularyVersionId',
    ])
    .where('fleetId', '=', fleetId)
    .where('id', '=', inspectionId)
    .executeTakeFirst();
  if (!inspection || inspection.driverId !== driverId) return null;
  const [tractor, trailer, fleet, context, rows, version] = await Promise.all([
    findFleetUnit(db, { fleetId, id: inspection.tractorId }),
    inspection.trailerId ? findFleetUnit(db, { fleetId, id: inspection.trailerId }) : Promise.resolve(undefined),
    findFleetSettings(db, { fleetId }),
    loadCheckContext(db, { fleetId, tractorId: inspection.tractorId, trailerId: inspection.trailerId }),
    listInspectionSteps(db, { inspectionId }),
    // The grammar of the version the inspection started with (read as text: see findVocabularyVersion).
    inspection.vocabularyVersionId
      ? findVocabularyVersion(db, { fleetId, id: inspection.vocabularyVersionId })
      : Promise.resolve(undefined),
  ]);
  const grammar = version?.grammar ?? getDefaultGrammar();
  // The version's own zone checklists (a trainer may have changed them).
  const zones = listWalkZones(grammar.zones, {
    kind: inspection.kind,
    configuration: configurationOf(!!inspection.trailerId),
  });
  // "photo" steps are an old kind no phone sends any more.
  const serverSteps: WalkStep[] = rows
    .flatMap((r) => (r.kind === 'photo' ? [] : [{ ...r, kind: r.kind }]))
    .map((r) => ({
      id: r.id,
      seq: r.seq,
      zone: r.zone,
      item: r.item,
      kind: r.kind,
      heard: r.heard,
      alternatives: Array.isArray(r.alternatives) ? (r.alternatives as string[]) : [],
      inputMode: r.inputMode,
      termKey: r.termKey,
      position: r.position,
      score: r.score,
      resolution: r.resolution,
      undoesStepId: r.undoesStepId,
      reading: r.value === null ? null : { value: Number(r.value) },
      notCheckedReason: r.notCheckedReason,
      note: r.note,
      deviceAt: r.deviceAt.toISOString(),
      label: [r.component, r.condition].filter(Boolean).join(', ') || undefined,
      verdict: r.verdict,
      severity: r.severity,
      limit: r.limitText,
      source: r.source,
    }));
  return {
    inspection: {
      id: inspection.id,
      kind: inspection.kind,
      status: inspection.status,
      startedAt: inspection.startedAt.toISOString(),
      sealNumber: inspection.sealNumber,
      ruleProfile: inspection.ruleProfile,
    },
    tractorNumber: tractor?.unitNumber ?? '?',
    trailerNumber: trailer?.unitNumber ?? null,
    minimumMinutes:
      inspection.kind === 'pre_trip' ? (fleet?.minPretripMinutes ?? 15) : (fleet?.minPosttripMinutes ?? 5),
    zones,
    requiredReadings: fleet?.requiredReadings ?? [...DEFAULT_REQUIRED_READINGS],
    context,
    serverSteps,
    grammar,
  };
}

export type WalkProps = NonNullable<Awaited<ReturnType<typeof loadWalkOrNull>>>;
