// What the recorded steps add up to: which items are answered and how, which zones were
// visited, which items are still open, what defects the report will carry. Pure, shared by the
// walk screen, the sign screen and the server.
import type { MeasureKind } from '@/lib/schemas/grammar';
import { isRequiredItem, type InspectionKind } from './zones';

export type ProgressStep = {
  id: string;
  seq: number;
  zone: string;
  item: string | null;
  kind: string;
  termKey: string | null;
  undoesStepId: string | null;
  verdict?: string | null;
  severity?: string | null;
};

export type ItemAnswer = 'ok' | 'defect' | 'measured' | 'failed' | 'not_checked';

/** Steps in order, without the ones an "undo" took back (the undo steps themselves stay recorded). */
export function listEffectiveSteps<S extends ProgressStep>(steps: readonly S[]): S[] {
  const ordered = [...steps].sort((a, b) => a.seq - b.seq);
  const undone = new Set(ordered.filter((s) => s.kind === 'undo' && s.undoesStepId).map((s) => s.undoesStepId));
  return ordered.filter((s) => s.kind !== 'undo' && !undone.has(s.id));
}

/** The last step that an "undo" would take back now. */
export function findUndoableStep<S extends ProgressStep>(steps: readonly S[]): S | undefined {
  return listEffectiveSteps(steps)
    .filter((s) => s.kind !== 'visit')
    .at(-1);
}

type ZoneShape = {
  id: string;
  name?: string;
  items: { id: string; component: string; measure?: MeasureKind; label?: string }[];
};

/**
 * Item id → its answer, from the effective steps. A "zone OK" answers the zone's open *visual*
 * items only: an item that needs a reading is answered by a number or by "not checked".
 */
export function mapItemAnswers(zones: readonly ZoneShape[], steps: readonly ProgressStep[]): Map<string, ItemAnswer> {
  const answers = new Map<string, ItemAnswer>();
  for (const s of listEffectiveSteps(steps)) {
    if (s.kind === 'ok' && s.item) answers.set(s.item, 'ok');
    else if (s.kind === 'not_checked' && s.item) answers.set(s.item, 'not_checked');
    else if (s.kind === 'measurement' && s.item) answers.set(s.item, s.verdict === 'fail' ? 'failed' : 'measured');
    else if (s.kind === 'defect') {
      const zone = zones.find((z) => z.id === s.zone);
      const component = s.termKey?.split(':')[0];
      const item = s.item ?? zone?.items.find((i) => i.component === component && !i.measure)?.id;
      if (item) answers.set(item, 'defect');
    } else if (s.kind === 'zone_ok') {
      for (const i of zones.find((z) => z.id === s.zone)?.items ?? [])
        if (!i.measure && !answers.has(i.id)) answers.set(i.id, 'ok');
    }
  }
  return answers;
}

export type OpenItem = {
  zone: string;
  zoneName: string;
  zoneIndex: number;
  item: string;
  label: string;
  reading: boolean;
};

/**
 * The items that still need an answer before the report can be signed: every visual item, and
 * every reading the fleet requires on this kind of inspection. Optional readings never block.
 */
export function listOpenItems(
  zones: readonly ZoneShape[],
  steps: readonly ProgressStep[],
  rules: { kind: InspectionKind; requiredReadings: readonly MeasureKind[] },
): OpenItem[] {
  const answers = mapItemAnswers(zones, steps);
  return zones.flatMap((z, zoneIndex) =>
    z.items
      .filter((i) => !answers.has(i.id) && isRequiredItem(i, rules))
      .map((i) => ({
        zone: z.id,
        zoneName: z.name ?? z.id,
        zoneIndex,
        item: i.id,
        label: i.label ?? i.id,
        reading: !!i.measure,
      })),
  );
}

export function listVisitedZones(steps: readonly ProgressStep[]): Set<string> {
  return new Set(listEffectiveSteps(steps).map((s) => s.zone));
}

/** The steps that become defects on the report: findings, and readings that failed with a severity. */
export function listDefectSteps<S extends ProgressStep>(steps: readonly S[]): S[] {
  return listEffectiveSteps(steps).filter(
    (s) => s.kind === 'defect' || (s.kind === 'measurement' && s.verdict === 'fail' && !!s.severity),
  );
}
