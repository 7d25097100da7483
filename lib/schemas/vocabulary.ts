import { z } from 'zod';
import { idSchema } from './common';
import { grammarSchema, zoneIdSchema, type Grammar } from './grammar';

/** Request and response shapes of /api/vocabulary/**, shared by the trainer screens and the handlers. */

export const termKeySchema = z.string().regex(/^[a-z0-9_]+:[a-z0-9_]+$/, 'a term is component_id:condition_id');

/** Every id a grammar refers to exists: systems of components, conditions of defects, components of checklist items. */
export function listGrammarProblems(g: Grammar): string[] {
  const problems: string[] = [];
  const systems = new Set(g.vocabulary.systems.map((s) => s.id));
  const conditions = new Set(g.vocabulary.conditions.map((c) => c.id));
  const components = new Set<string>();
  for (const c of g.vocabulary.components) {
    if (components.has(c.id)) problems.push(`component “${c.id}” appears twice`);
    components.add(c.id);
    if (!systems.has(c.system)) problems.push(`component “${c.name}” names system “${c.system}”, which does not exist`);
    for (const d of c.defects)
      if (!conditions.has(d.condition))
        problems.push(`component “${c.name}” names condition “${d.condition}”, which does not exist`);
  }
  for (const zone of g.zones.zones)
    for (const item of zone.items)
      if (!components.has(item.component))
        problems.push(
          `checklist item “${item.label}” (${zone.name}) names component “${item.component}”, which does not exist`,
        );
  return problems;
}

export const checkedGrammarSchema = grammarSchema.superRefine((g, ctx) => {
  for (const message of listGrammarProblems(g)) ctx.addIssue({ code: 'custom', message, path: ['vocabulary'] });
});

export const createVersionBodySchema = z.object({
  label: z.string().trim().min(1).max(60).optional(),
  basedOnId: idSchema.optional(),
});
export type CreateVersionBody = z.infer<typeof createVersionBodySchema>;

export const updateDraftBodySchema = z.object({
  grammar: checkedGrammarSchema,
  label: z.string().trim().min(1).max(60).optional(),
  /** The draft's updatedAt when the editor loaded it: a save over someone else's newer save is refused (409). */
  baseUpdatedAt: z.iso.datetime({ offset: true }).optional(),
});
export type UpdateDraftBody = z.infer<typeof updateDraftBodySchema>;

export const addPhraseBodySchema = z.object({
  termKey: termKeySchema,
  /** What the driver said (or a phrase typed by the trainer). */
  text: z.string().trim().min(1).max(200),
  /** Which slot the phrase goes to; worked out from the text when absent. */
  slot: z.enum(['component', 'condition']).optional(),
  /** The exact phrase to add; worked out from the text when absent. */
  phrase: z.string().trim().min(1).max(80).optional(),
  /** Field utterances this answers: marked resolved. */
  utteranceIds: z.array(idSchema).max(500).default([]),
});
export type AddPhraseBody = z.input<typeof addPhraseBodySchema>;

export const benchBodySchema = z.object({
  text: z.string().trim().min(1).max(400),
  zone: zoneIdSchema.nullable().optional(),
});
export type BenchBody = z.infer<typeof benchBodySchema>;

export const publishBodySchema = z.object({
  /** Needed when the draft scores lower than the published version on the labelled set. */
  override: z.object({ reason: z.string().trim().min(10, 'say why, in at least 10 characters').max(500) }).optional(),
});
export type PublishBody = z.infer<typeof publishBodySchema>;

/** Any of the grammars/ files; the parts left out are kept from the draft (or the published version). */
export const importGrammarBodySchema = z.object({
  files: z
    .object({
      vocabulary: z.unknown(),
      commands: z.unknown(),
      positions: z.unknown(),
      numbers: z.unknown(),
      zones: z.unknown(),
    })
    .partial(),
});
export type ImportGrammarBody = z.infer<typeof importGrammarBodySchema>;

export const labelledUtteranceSchema = z.object({
  text: z.string().min(1).max(400),
  zone: z.string().optional(),
  ctx: z
    .object({
      zone: z.string().nullable().optional(),
      measure: z.string().nullable().optional(),
      component: z.string().nullable().optional(),
      profile: z.enum(['us', 'ca']).optional(),
    })
    .optional(),
  kind: z.enum(['defect', 'ok', 'measurement', 'command', 'unknown']),
  termId: z.string().optional(),
  command: z.string().optional(),
  measure: z.string().optional(),
  value: z.number().optional(),
  unit: z.string().optional(),
  component: z.string().optional(),
  position: z.string().optional(),
});

/** The most lines a fleet's labelled set may hold: every evaluation scores all of them. */
export const maxTestSetLines = 5000;

export const saveTestSetBodySchema = z.object({
  name: z.string().trim().min(1).max(80),
  jsonl: z
    .string()
    .min(1)
    .max(2_000_000)
    .superRefine((v, ctx) => {
      const lines = v.split('\n').filter((l) => l.trim()).length;
      if (lines > maxTestSetLines)
        ctx.addIssue({
          code: 'custom',
          message: `A labelled set holds at most ${maxTestSetLines.toLocaleString('en-US')} lines; this one has ${lines.toLocaleString('en-US')}.`,
        });
    }),
});
export type SaveTestSetBody = z.infer<typeof saveTestSetBodySchema>;

export const dismissUtterancesBodySchema = z.object({ ids: z.array(idSchema).min(1).max(500) });
export type DismissUtterancesBody = z.infer<typeof dismissUtterancesBodySchema>;

// Responses

export type VersionSummary = {
  id: string;
  label: string;
  status: 'draft' | 'published';
  basedOnId: string | null;
  publishedAt: string | null;
  publishedBy: string | null;
  createdAt: string;
  updatedAt: string;
  inspections: number;
};

export type VersionDetail = Omit<VersionSummary, 'inspections'> & { grammar: Grammar };

export type Figures = { total: number; top1: number; top3: number; top1Rate: number; top3Rate: number };

export type EvaluationLine = {
  text: string;
  zone: string | null;
  expected: string;
  got: string;
  score: number;
  top3: boolean;
};

export type EvaluationReport = {
  set: { name: string; count: number; source: 'fleet' | 'default' };
  version: { id: string; label: string; status: 'draft' | 'published' };
  figures: Figures;
  misses: EvaluationLine[];
  published: { id: string; label: string; figures: Figures } | null;
  /** Lines the published version gets right and this one misses, and the other way round. */
  newlyMissed: EvaluationLine[];
  newlyFixed: EvaluationLine[];
  lowersAccuracy: boolean;
  /** The draft on further sets: the repository's spoken held-out set and the fleet's field-labelled lines. */
  otherSets?: { name: string; figures: Figures; misses: EvaluationLine[] }[];
};

export type BenchMatch = {
  kind: string;
  termId: string | null;
  label: string;
  score: number;
  needsConfirmation: boolean;
  position: string | null;
  severity: string | null;
  value: number | null;
  unit: string | null;
  alternatives: { termId: string; label: string; score: number }[];
};

export type BenchResult = {
  text: string;
  normalized: string;
  numbers: { value: number; unit: string | null; words: string }[];
  draft: { versionId: string; label: string; match: BenchMatch } | null;
  published: { versionId: string; label: string; match: BenchMatch } | null;
};

export type FieldUtteranceGroup = {
  key: string;
  text: string;
  count: number;
  ids: string[];
  variants: { text: string; count: number }[];
  outcomes: Record<string, number>;
  zones: string[];
  lastSeen: string;
  /** The term the driver ended up with, or the draft's best guess. */
  suggestion: { termKey: string; label: string } | null;
};
