// One case per vocabulary route, with a valid request, for the route × role matrix. Calls act in
// the fixture's fleet; the ones that need a draft open (or reuse) the fleet's draft first.
import { randomUUID } from 'node:crypto';
import * as bench from '@/app/api/vocabulary/bench/route';
import * as fieldUtterances from '@/app/api/vocabulary/field-utterances/route';
import * as importGrammar from '@/app/api/vocabulary/import/route';
import * as testSet from '@/app/api/vocabulary/test-set/route';
import * as evaluation from '@/app/api/vocabulary/versions/[id]/evaluation/route';
import * as exportGrammar from '@/app/api/vocabulary/versions/[id]/export/route';
import * as phrases from '@/app/api/vocabulary/versions/[id]/phrases/route';
import * as publish from '@/app/api/vocabulary/versions/[id]/publish/route';
import * as version from '@/app/api/vocabulary/versions/[id]/route';
import * as versions from '@/app/api/vocabulary/versions/route';
import zones from '@/grammars/zones.json' with { type: 'json' };
import { getDefaultGrammar } from '@/lib/db/vocabulary';
import { createDraftVersion } from '@/lib/services/vocabulary/create-draft-version';
import type { FleetFixture } from '../../setup/fleet-fixture';
import { callRoute, makeRequest } from '../../setup/session';

type Case = {
  route: string;
  method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  allowed: readonly ['trainer'];
  call: (f: FleetFixture, cookie?: string) => Promise<Response>;
};

const draftOf = async (f: FleetFixture) =>
  (await createDraftVersion({ fleetId: f.fleet.id, actorId: f.users.trainer.id, body: {} })).version.id;
const trainer = ['trainer'] as const;

export const vocabularyRouteCases: Case[] = [
  {
    route: 'vocabulary/versions',
    method: 'GET',
    allowed: trainer,
    call: (_f, cookie) => callRoute(versions.GET, makeRequest('/api/vocabulary/versions', { cookie })),
  },
  {
    route: 'vocabulary/versions',
    method: 'POST',
    allowed: trainer,
    call: (_f, cookie) =>
      callRoute(versions.POST, makeRequest('/api/vocabulary/versions', { method: 'POST', cookie, json: {} })),
  },
  {
    route: 'vocabulary/versions/[id]',
    method: 'GET',
    allowed: trainer,
    call: async (f, cookie) => {
      const id = await draftOf(f);
      return callRoute(version.GET, makeRequest(`/api/vocabulary/versions/${id}`, { cookie }), { id });
    },
  },
  {
    route: 'vocabulary/versions/[id]',
    method: 'PUT',
    allowed: trainer,
    call: async (f, cookie) => {
      const id = await draftOf(f);
      return callRoute(
        version.PUT,
        makeRequest(`/api/vocabulary/versions/${id}`, {
          method: 'PUT',
          cookie,
          json: { grammar: getDefaultGrammar() },
        }),
        { id },
      );
    },
  },
  {
    route: 'vocabulary/versions/[id]/phrases',
    method: 'POST',
    allowed: trainer,
    call: async (f, cookie) => {
      const id = await draftOf(f);
      return callRoute(
        phrases.POST,
        makeRequest(`/api/vocabulary/versions/${id}/phrases`, {
          method: 'POST',
          cookie,
          json: { termKey: 'mud_flap:loose', text: 'mud flap jitterbug', slot: 'condition', phrase: 'jitterbug' },
        }),
        { id },
      );
    },
  },
  {
    route: 'vocabulary/versions/[id]/evaluation',
    method: 'POST',
    allowed: trainer,
    call: async (f, cookie) => {
      const id = await draftOf(f);
      return callRoute(
        evaluation.POST,
        makeRequest(`/api/vocabulary/versions/${id}/evaluation`, { method: 'POST', cookie }),
        { id },
      );
    },
  },
  {
    route: 'vocabulary/versions/[id]/publish',
    method: 'POST',
    allowed: trainer,
    call: async (f, cookie) => {
      const id = await draftOf(f);
      return callRoute(
        publish.POST,
        makeRequest(`/api/vocabulary/versions/${id}/publish`, {
          method: 'POST',
          cookie,
          json: { override: { reason: 'route matrix check of the publish route' } },
        }),
        { id },
      );
    },
  },
  {
    route: 'vocabulary/versions/[id]/export',
    method: 'GET',
    allowed: trainer,
    call: async (f, cookie) => {
      const id = await draftOf(f);
      return callRoute(exportGrammar.GET, makeRequest(`/api/vocabulary/versions/${id}/export?file=zones`, { cookie }), {
        id,
      });
    },
  },
  {
    route: 'vocabulary/import',
    method: 'POST',
    allowed: trainer,
    call: (_f, cookie) =>
      callRoute(
        importGrammar.POST,
        makeRequest('/api/vocabulary/import', { method: 'POST', cookie, json: { files: { zones } } }),
      ),
  },
  {
    route: 'vocabulary/bench',
    method: 'POST',
    allowed: trainer,
    call: (_f, cookie) =>
      callRoute(
        bench.POST,
        makeRequest('/api/vocabulary/bench', {
          method: 'POST',
          cookie,
          json: { text: 'bulge on the left steer tire', zone: 'front' },
        }),
      ),
  },
  {
    route: 'vocabulary/field-utterances',
    method: 'GET',
    allowed: trainer,
    call: (_f, cookie) => callRoute(fieldUtterances.GET, makeRequest('/api/vocabulary/field-utterances', { cookie })),
  },
  {
    route: 'vocabulary/field-utterances',
    method: 'PATCH',
    allowed: trainer,
    call: (_f, cookie) =>
      callRoute(
        fieldUtterances.PATCH,
        makeRequest('/api/vocabulary/field-utterances', { method: 'PATCH', cookie, json: { ids: [randomUUID()] } }),
      ),
  },
  {
    route: 'vocabulary/test-set',
    method: 'GET',
    allowed: trainer,
    call: (_f, cookie) => callRoute(testSet.GET, makeRequest('/api/vocabulary/test-set', { cookie })),
  },
  {
    route: 'vocabulary/test-set',
    method: 'PUT',
    allowed: trainer,
    call: (_f, cookie) =>
      callRoute(
        testSet.PUT,
        makeRequest('/api/vocabulary/test-set', {
          method: 'PUT',
          cookie,
          json: { name: 'matrix set', jsonl: '{"text":"next","kind":"command","command":"next"}\n' },
        }),
      ),
  },
];
