// What the recorded steps add up to: which items are answered, which zones were visited, what
// defects the report will carry. Pure, shared by the walk screen, the summary and the server.

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

export type ItemAnswer = 'ok' | 'defect' | 'measured' | 'failed';

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

type WalkZoneShape = { id: string; items: { id: string; component: string }[] };

/** Item id → its answer, from the effective steps. A "zone OK" answers the zone's open items. */
export function mapItemAnswers(
  zones: readonly WalkZoneShape[],
  steps: readonly ProgressStep[],
): Map<string, ItemAnswer> {
  const answers = new Map<string, ItemAnswer>();
  for (const s of listEffectiveSteps(steps)) {
    if (s.kind === 'ok' && s.item) answers.set(s.item, 'ok');
    else if (s.kind === 'measurement' && s.item) answers.set(s.item, s.verdict === 'fail' ? 'failed' : 'measured');
    else if (s.kind === 'defect') {
      const zone = zones.find((z) => z.id === s.zone);
      const component = s.termKey?.split(':')[0];
      const item = s.item ?? zone?.items.find((i) => i.component === component)?.id;
      if (item) answers.set(item, 'defect');
    } else if (s.kind === 'zone_ok') {
      for (const i of zones.find((z) => z.id === s.zone)?.items ?? []) if (!answers.has(i.id)) answers.set(i.id, 'ok');
    }
  }
  return answers;
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
