import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as inspections from '@/app/api/inspections/route';
import * as bench from '@/app/api/vocabulary/bench/route';
import * as fieldUtterances from '@/app/api/vocabulary/field-utterances/route';
import * as importRoute from '@/app/api/vocabulary/import/route';
import * as testSet from '@/app/api/vocabulary/test-set/route';
import * as evaluation from '@/app/api/vocabulary/versions/[id]/evaluation/route';
import * as exportRoute from '@/app/api/vocabulary/versions/[id]/export/route';
import * as phrases from '@/app/api/vocabulary/versions/[id]/phrases/route';
import * as publish from '@/app/api/vocabulary/versions/[id]/publish/route';
import * as version from '@/app/api/vocabulary/versions/[id]/route';
import * as versions from '@/app/api/vocabulary/versions/route';
import defaultVocabulary from '@/grammars/vocabulary.json' with { type: 'json' };
import { getDefaultGrammar } from '@/lib/db/vocabulary';
import { createMatcher, type MatchContext, type MatchResult } from '@/lib/matcher';
import {
  getLabelledContext,
  isTopOneCorrect,
  isTopThreeCorrect,
  parseLabelledJsonl,
  type LabelledUtterance,
} from '@/lib/matcher/fixture-scoring';
import type { Grammar } from '@/lib/schemas/grammar';
import type {
  BenchMatch,
  BenchResult,
  EvaluationReport,
  FieldUtteranceGroup,
  VersionDetail,
  VersionSummary,
} from '@/lib/schemas/vocabulary';
import { scoreLabelledSet } from '@/lib/services/vocabulary/evaluate-vocabulary';
import { loadWalkOrNull } from '@/lib/services/inspections/load-walk';
import { makeFleetFixture, type FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';
import { getTestDb } from '../../setup/test-db';
import { readError, readJson } from '../../setup/read-json';

type Inbox = { groups: FieldUtteranceGroup[] };
type PhraseAdded = { slot: string; target: string; resolved: number; match: BenchMatch };

const db = getTestDb();
let f: FleetFixture;
const heard = 'mud flap doing the jitterbug';

beforeAll(async () => {
  f = await makeFleetFixture(db, 'Vocabulary fleet');
});
afterAll(() => db.destroy());

const asTrainer = (init: { method?: string; json?: unknown } = {}) => ({ ...init, cookie: f.cookies.trainer });
const openDraft = async () =>
  readJson<VersionDetail>(
    await callRoute(versions.POST, makeRequest('/api/vocabulary/versions', asTrainer({ method: 'POST', json: {} }))),
  );
const publishDraft = (id: string, json: unknown = {}) =>
  callRoute(publish.POST, makeRequest(`/api/vocabulary/versions/${id}/publish`, asTrainer({ method: 'POST', json })), {
    id,
  });
const runBench = async (text: string, zone = 'rear') =>
  readJson<BenchResult>(
    await callRoute(
      bench.POST,
      makeRequest('/api/vocabulary/bench', asTrainer({ method: 'POST', json: { text, zone } })),
    ),
  );
const startInspection = async (id: string) => {
  const res = await callRoute(
    inspections.POST,
    makeRequest('/api/inspections', {
      method: 'POST',
      cookie: f.cookies.driver,
      json: {
        id,
        kind: 'post_trip',
        tractorId: f.tractor.id,
        trailerId: f.trailer.id,
        odometer: 1000,
        startedAt: new Date().toISOString(),
      },
    }),
  );
  expect(res.status, await res.clone().text()).toBe(201);
  return (
    await db.selectFrom('inspection').select('vocabularyVersionId').where('id', '=', id).executeTakeFirstOrThrow()
  ).vocabularyVersionId;
};

describe('versions', () => {
  let first: VersionDetail;
  let second: VersionDetail;
  const before = randomUUID();
  const after = randomUUID();

  it('opens a first draft from the default files and publishes it', async () => {
    first = await openDraft();
    expect(first.status).toBe('draft');
    expect(first.grammar.vocabulary).toEqual(defaultVocabulary);
    const res = await publishDraft(first.id);
    expect(res.status, await res.clone().text()).toBe(200);
    expect((await readJson<{ version: VersionDetail }>(res)).version.status).toBe('published');
  });

  it('a phrase added in the draft changes the draft’s match and not the published one', async () => {
    second = await openDraft();
    expect(second.basedOnId).toBe(first.id);
    expect((await runBench(heard)).draft?.match.kind).toBe('unknown');
    const ids: string[] = [];
    for (const text of [heard, 'Mud flap, doing the jitterbug!', 'uh mud flaps doing the jitterbug']) {
      ids.push(
        (
          await db
            .insertInto('fieldUtterance')
            .values({ fleetId: f.fleet.id, zone: 'rear', text, normalized: text.toLowerCase(), outcome: 'unmatched' })
            .returning('id')
            .executeTakeFirstOrThrow()
        ).id,
      );
    }
    const inbox = await readJson<Inbox>(
      await callRoute(fieldUtterances.GET, makeRequest('/api/vocabulary/field-utterances', asTrainer())),
    );
    const group = inbox.groups.find((g) => g.ids.includes(ids[0]!));
    expect(group?.count).toBe(3); // grouped by similar text
    const added = await callRoute(
      phrases.POST,
      makeRequest(
        `/api/vocabulary/versions/${second.id}/phrases`,
        asTrainer({ method: 'POST', json: { termKey: 'mud_flap:loose', text: heard, utteranceIds: group?.ids } }),
      ),
      { id: second.id },
    );
    expect(added.status, await added.clone().text()).toBe(201);
    const body = await readJson<PhraseAdded>(added);
    expect(body).toMatchObject({ slot: 'condition', target: 'loose', resolved: 3 });
    expect(body.match.termId).toBe('mud_flap:loose');

    const after = await runBench(heard);
    expect(after.draft?.match.termId).toBe('mud_flap:loose');
    expect(after.draft?.match.score).toBeGreaterThanOrEqual(0.75);
    expect(after.published?.versionId).toBe(first.id);
    expect(after.published?.match.kind).toBe('unknown');
    const inboxAfter = await readJson<Inbox>(
      await callRoute(fieldUtterances.GET, makeRequest('/api/vocabulary/field-utterances', asTrainer())),
    );
    expect(inboxAfter.groups.some((g) => g.ids.includes(ids[0]!))).toBe(false);
  });

  it('an inspection started before publishing keeps its version; the next one gets the new one', async () => {
    expect(await startInspection(before)).toBe(first.id);
    const res = await publishDraft(second.id);
    expect(res.status, await res.clone().text()).toBe(200);
    expect(await startInspection(after)).toBe(second.id);
    expect(
      await db
        .selectFrom('inspection')
        .select('vocabularyVersionId')
        .where('id', '=', before)
        .executeTakeFirstOrThrow(),
    ).toEqual({ vocabularyVersionId: first.id });
    const oldWalk = await loadWalkOrNull(db, {
      fleetId: f.fleet.id,
      driverId: f.users.driver.id,
      inspectionId: before,
    });
    const newWalk = await loadWalkOrNull(db, { fleetId: f.fleet.id, driverId: f.users.driver.id, inspectionId: after });
    expect(createMatcher(oldWalk!.grammar).match(heard, { zone: 'rear' }).kind).toBe('unknown');
    expect(createMatcher(newWalk!.grammar).match(heard, { zone: 'rear' }).termId).toBe('mud_flap:loose');
  });

  it('a published version is immutable: the API answers 409 and the database refuses', async () => {
    const put = await callRoute(
      version.PUT,
      makeRequest(
        `/api/vocabulary/versions/${second.id}`,
        asTrainer({ method: 'PUT', json: { grammar: getDefaultGrammar() } }),
      ),
      { id: second.id },
    );
    expect(put.status).toBe(409);
    expect((await publishDraft(second.id)).status).toBe(409);
    await expect(
      db.updateTable('vocabularyVersion').set({ label: 'changed' }).where('id', '=', second.id).execute(),
    ).rejects.toThrow(/published and cannot change/);
    await expect(db.deleteFrom('vocabularyVersion').where('id', '=', second.id).execute()).rejects.toThrow(
      /published and cannot change/,
    );
    const list = await readJson<{ versions: VersionSummary[] }>(
      await callRoute(versions.GET, makeRequest('/api/vocabulary/versions', asTrainer())),
    );
    expect(list.versions.map((v) => [v.id, v.status, v.inspections])).toEqual([
      [second.id, 'published', 1],
      [first.id, 'published', 1],
    ]);
  });

  it('a draft that lowers accuracy is published only with an override and its reason, kept in the audit log', async () => {
    const draft = await openDraft();
    const worse = structuredClone(draft.grammar);
    const tire = worse.vocabulary.components.find((c) => c.id === 'steer_tire')!;
    tire.phrases = ['steer tire'];
    for (const c of worse.vocabulary.conditions) if (c.id === 'bulge') c.phrases = ['bulge'];
    const saved = await callRoute(
      version.PUT,
      makeRequest(`/api/vocabulary/versions/${draft.id}`, asTrainer({ method: 'PUT', json: { grammar: worse } })),
      { id: draft.id },
    );
    expect(saved.status, await saved.clone().text()).toBe(200);
    const report = await readJson<EvaluationReport>(
      await callRoute(
        evaluation.POST,
        makeRequest(`/api/vocabulary/versions/${draft.id}/evaluation`, asTrainer({ method: 'POST' })),
        { id: draft.id },
      ),
    );
    expect(report.lowersAccuracy).toBe(true);
    expect(report.figures.top1).toBeLessThan(report.published!.figures.top1);
    expect(report.newlyMissed.length).toBeGreaterThan(0);

    const refused = await publishDraft(draft.id);
    expect(refused.status).toBe(409);
    expect((await readError(refused)).fields?.override).toBeDefined();
    const tooShort = await publishDraft(draft.id, { override: { reason: 'ok' } });
    expect(tooShort.status).toBe(422);
    const reason = 'Steer tire phrases trimmed on purpose for the yard trial';
    const forced = await publishDraft(draft.id, { override: { reason } });
    expect(forced.status, await forced.clone().text()).toBe(200);
    const audit = await db
      .selectFrom('auditLog')
      .select(['action', 'actorId', 'detail'])
      .where('entityId', '=', draft.id)
      .where('action', 'like', 'vocabulary.published%')
      .execute();
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({ action: 'vocabulary.published_with_override', actorId: f.users.trainer.id });
    expect(audit[0]!.detail).toMatchObject({ overrideReason: reason });
  });
});

/** The `npm run -s match` contract over a labelled set: one CLI run per match context, as a user would call it. */
async function scoreWithCli(items: LabelledUtterance[]) {
  const groups = new Map<string, { ctx: MatchContext; items: LabelledUtterance[] }>();
  for (const u of items) {
    const ctx = getLabelledContext(u);
    const key = JSON.stringify(ctx);
    if (!groups.has(key)) groups.set(key, { ctx, items: [] });
    groups.get(key)!.items.push(u);
  }
  const run = (g: { ctx: MatchContext; items: LabelledUtterance[] }) =>
    new Promise<MatchResult[]>((resolve, reject) => {
      const flags = Object.entries(g.ctx).flatMap(([k, v]) => (v ? [`--${k}`, String(v)] : []));
      const child = spawn(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'scripts/match.ts', ...flags], {
        cwd: path.resolve(__dirname, '../../..'),
      });
      let out = '';
      child.stdout.on('data', (d) => (out += d));
      child.on('error', reject);
      child.on('close', (code) =>
        code === 0
          ? resolve(
              out
                .trim()
                .split('\n')
                .map((l) => JSON.parse(l) as MatchResult),
            )
          : reject(new Error(`match exited ${code}`)),
      );
      child.stdin.end(`${g.items.map((u) => u.text).join('\n')}\n`);
    });
  let top1 = 0;
  let top3 = 0;
  const list = [...groups.values()];
  for (let i = 0; i < list.length; i += 4) {
    const batch = list.slice(i, i + 4);
    const outs = await Promise.all(batch.map(run));
    batch.forEach((g, j) =>
      g.items.forEach((u, k) => {
        const r = outs[j]![k]!;
        expect(r.input).toBe(u.text);
        if (isTopOneCorrect(u, r)) top1 += 1;
        if (isTopThreeCorrect(u, r)) top3 += 1;
      }),
    );
  }
  return { total: items.length, top1, top3 };
}

describe('evaluation', () => {
  // The tuning set scores (nearly) everything right; the held-out set has real misses, so both are compared.
  it.each([
    ['utterances.jsonl', 'default'],
    ['holdout-2.jsonl', 'fleet'],
  ] as const)(
    'on %s gives the same top-1 and top-3 as the `npm run -s match` contract',
    async (file, source) => {
      const jsonl = readFileSync(path.resolve(__dirname, `../../fixtures/matcher/${file}`), 'utf8');
      const items = parseLabelledJsonl(jsonl);
      const cli = await scoreWithCli(items);
      const fleet = await makeFleetFixture(db, `Evaluation fleet ${file}`);
      const cookie = fleet.cookies.trainer;
      if (source === 'fleet')
        expect(
          (
            await callRoute(
              testSet.PUT,
              makeRequest('/api/vocabulary/test-set', { method: 'PUT', cookie, json: { name: file, jsonl } }),
            )
          ).status,
        ).toBe(200);
      const draft = await readJson<VersionDetail>(
        await callRoute(versions.POST, makeRequest('/api/vocabulary/versions', { method: 'POST', cookie, json: {} })),
      );
      const report = await readJson<EvaluationReport>(
        await callRoute(
          evaluation.POST,
          makeRequest(`/api/vocabulary/versions/${draft.id}/evaluation`, { method: 'POST', cookie }),
          { id: draft.id },
        ),
      );
      console.log(
        `${file} (${cli.total} lines): CLI top-1 ${cli.top1}, top-3 ${cli.top3}; evaluation top-1 ${report.figures.top1}, top-3 ${report.figures.top3}`,
      );
      expect(report.set).toMatchObject({ source, count: items.length });
      expect({ total: report.figures.total, top1: report.figures.top1, top3: report.figures.top3 }).toEqual(cli);
      expect(report.misses).toHaveLength(cli.total - cli.top1);
      expect(scoreLabelledSet(createMatcher(getDefaultGrammar()), items).figures).toEqual(report.figures);
    },
    120_000,
  );

  it('imports a fleet’s own labelled set, scores on it and exports it back; a bad line is named', async () => {
    const jsonl = [
      '{"text": "bulge on the left steer tire", "zone": "front", "kind": "defect", "termId": "steer_tire:bulge"}',
      '{"text": "next", "kind": "command", "command": "next"}',
      `{"text": "${heard}", "zone": "rear", "kind": "defect", "termId": "mud_flap:loose"}`,
    ].join('\n');
    const bad = await callRoute(
      testSet.PUT,
      makeRequest(
        '/api/vocabulary/test-set',
        asTrainer({ method: 'PUT', json: { name: 'yard set', jsonl: `${jsonl}\n{"text": "x"` } }),
      ),
    );
    expect(bad.status).toBe(422);
    expect((await readError(bad)).message).toMatch(/line 4/);
    const ok = await callRoute(
      testSet.PUT,
      makeRequest('/api/vocabulary/test-set', asTrainer({ method: 'PUT', json: { name: 'yard set', jsonl } })),
    );
    expect(ok.status, await ok.clone().text()).toBe(200);
    const back = await callRoute(testSet.GET, makeRequest('/api/vocabulary/test-set?format=jsonl', asTrainer()));
    expect((await back.text()).trim()).toBe(jsonl);
    const draft = await openDraft();
    const report = await readJson<EvaluationReport>(
      await callRoute(
        evaluation.POST,
        makeRequest(`/api/vocabulary/versions/${draft.id}/evaluation`, asTrainer({ method: 'POST' })),
        { id: draft.id },
      ),
    );
    expect(report.set).toMatchObject({ name: 'yard set', source: 'fleet', count: 3 });
    expect(report.figures.top1).toBe(3);
  });

  it('also scores the draft on the spoken held-out set and on the field utterances drivers corrected', async () => {
    const fleet = await makeFleetFixture(db, 'Evaluation other sets fleet');
    const cookie = fleet.cookies.trainer;
    const corrected = [
      { text: 'bulge on the left steer tire', zone: 'front', termKey: 'steer_tire:bulge' },
      { text: 'mud flap flapping around', zone: 'rear', termKey: 'mud_flap:loose' },
    ];
    await db
      .insertInto('fieldUtterance')
      .values(
        corrected.map((c) => ({ fleetId: fleet.fleet.id, ...c, normalized: c.text, outcome: 'corrected' as const })),
      )
      .execute();
    // an unmatched line without a term is not a labelled line
    await db
      .insertInto('fieldUtterance')
      .values({ fleetId: fleet.fleet.id, zone: 'rear', text: 'huh', normalized: 'huh', outcome: 'unmatched' })
      .execute();
    const draft = await readJson<VersionDetail>(
      await callRoute(versions.POST, makeRequest('/api/vocabulary/versions', { method: 'POST', cookie, json: {} })),
    );
    const report = await readJson<EvaluationReport>(
      await callRoute(
        evaluation.POST,
        makeRequest(`/api/vocabulary/versions/${draft.id}/evaluation`, { method: 'POST', cookie }),
        { id: draft.id },
      ),
    );
    const heldOut = parseLabelledJsonl(
      readFileSync(path.resolve(__dirname, '../../fixtures/matcher/held-out-spoken.jsonl'), 'utf8'),
    );
    const [spoken, field] = report.otherSets ?? [];
    expect(spoken?.figures).toEqual(scoreLabelledSet(createMatcher(getDefaultGrammar()), heldOut).figures);
    expect(field?.figures.total).toBe(2);
    expect(field?.figures).toEqual(
      scoreLabelledSet(
        createMatcher(getDefaultGrammar()),
        corrected.map((c) => ({ text: c.text, zone: c.zone, kind: 'defect' as const, termId: c.termKey })),
      ).figures,
    );
  });
});

describe('export and import in the grammars/ format', () => {
  it('exports each file as in grammars/, reads a stored bare vocabulary as a full grammar, and imports into the draft', async () => {
    const fleet = await makeFleetFixture(db, 'Export fleet');
    const bare = await db
      .insertInto('vocabularyVersion')
      .values({
        fleetId: fleet.fleet.id,
        label: 'seeded',
        status: 'published',
        grammar: JSON.stringify(defaultVocabulary),
        publishedAt: new Date(),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const cookie = fleet.cookies.trainer;
    for (const file of ['vocabulary', 'commands', 'positions', 'numbers', 'zones']) {
      const res = await callRoute(
        exportRoute.GET,
        makeRequest(`/api/vocabulary/versions/${bare.id}/export?file=${file}`, { cookie }),
        { id: bare.id },
      );
      expect(res.headers.get('content-disposition')).toContain(`${file}.json`);
      expect(JSON.parse(await res.text())).toEqual(
        JSON.parse(readFileSync(path.resolve(__dirname, `../../../grammars/${file}.json`), 'utf8')),
      );
    }
    const whole = await readJson<Grammar>(
      await callRoute(exportRoute.GET, makeRequest(`/api/vocabulary/versions/${bare.id}/export`, { cookie }), {
        id: bare.id,
      }),
    );
    expect(Object.keys(whole).sort()).toEqual(['commands', 'numbers', 'positions', 'vocabulary', 'zones']);

    const vocabulary = structuredClone(whole.vocabulary);
    vocabulary.conditions.find((c) => c.id === 'loose')!.phrases.push('jitterbug');
    const imported = await callRoute(
      importRoute.POST,
      makeRequest('/api/vocabulary/import', { method: 'POST', cookie, json: { files: { vocabulary } } }),
    );
    expect(imported.status, await imported.clone().text()).toBe(200);
    const { version: draft } = await readJson<{ version: VersionDetail }>(imported);
    expect(draft).toMatchObject({ status: 'draft', basedOnId: bare.id });
    expect(createMatcher(draft.grammar).match(heard, { zone: 'rear' }).termId).toBe('mud_flap:loose');

    vocabulary.components[0]!.system = 'no_such_system';
    const broken = await callRoute(
      importRoute.POST,
      makeRequest('/api/vocabulary/import', { method: 'POST', cookie, json: { files: { vocabulary } } }),
    );
    expect(broken.status).toBe(422);
    expect((await readError(broken)).message).toMatch(/no_such_system/);
    const notAGrammar = await callRoute(
      importRoute.POST,
      makeRequest('/api/vocabulary/import', { method: 'POST', cookie, json: { files: { zones: { version: 1 } } } }),
    );
    expect(notAGrammar.status).toBe(422);
  });

  it('a save over someone else’s newer save of the draft is refused', async () => {
    const draft = await openDraft();
    const put = (baseUpdatedAt: string) =>
      callRoute(
        version.PUT,
        makeRequest(
          `/api/vocabulary/versions/${draft.id}`,
          asTrainer({ method: 'PUT', json: { grammar: draft.grammar, baseUpdatedAt } }),
        ),
        { id: draft.id },
      );
    const first = await put(draft.updatedAt);
    expect(first.status, await first.clone().text()).toBe(200);
    const stale = await put(draft.updatedAt);
    expect(stale.status).toBe(409);
    expect((await readError(stale)).message).toMatch(/someone else/);
    expect((await put((await readJson<VersionDetail>(first)).updatedAt)).status).toBe(200);
  });

  it("another fleet's version is 404", async () => {
    const other = await makeFleetFixture(db, 'Other vocabulary fleet');
    const theirs = await readJson<VersionDetail>(
      await callRoute(
        versions.POST,
        makeRequest('/api/vocabulary/versions', { method: 'POST', cookie: other.cookies.trainer, json: {} }),
      ),
    );
    const res = await callRoute(version.GET, makeRequest(`/api/vocabulary/versions/${theirs.id}`, asTrainer()), {
      id: theirs.id,
    });
    expect(res.status).toBe(404);
  });
});
