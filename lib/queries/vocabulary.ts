import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { fetchJson } from '@/lib/http/fetch-json';
import type { Grammar } from '@/lib/schemas/grammar';
import type {
  AddPhraseBody,
  BenchBody,
  BenchMatch,
  BenchResult,
  EvaluationReport,
  FieldUtteranceGroup,
  ImportGrammarBody,
  PublishBody,
  SaveTestSetBody,
  VersionDetail,
  VersionSummary,
} from '@/lib/schemas/vocabulary';

export const vocabularyKeys = {
  all: ['vocabulary'] as const,
  versions: () => [...vocabularyKeys.all, 'versions'] as const,
  version: (id: string) => [...vocabularyKeys.all, 'version', id] as const,
  inbox: () => [...vocabularyKeys.all, 'inbox'] as const,
  testSet: () => [...vocabularyKeys.all, 'test-set'] as const,
};

export type TestSetSummary = { name: string; source: 'fleet' | 'default'; count: number; updatedAt: string | null };
export type InboxData = { groups: FieldUtteranceGroup[]; total: number; versionId: string | null };
export type AddPhraseResult = {
  slot: 'component' | 'condition';
  phrase: string;
  target: string;
  resolved: number;
  match: BenchMatch;
};
export type PublishResult = { version: VersionDetail; evaluation: EvaluationReport; override: boolean };

export const versionListOptions = () =>
  queryOptions({
    queryKey: vocabularyKeys.versions(),
    queryFn: () => fetchJson<{ versions: VersionSummary[] }>('/api/vocabulary/versions'),
  });
export const versionOptions = (id: string) =>
  queryOptions({
    queryKey: vocabularyKeys.version(id),
    queryFn: () => fetchJson<VersionDetail>(`/api/vocabulary/versions/${id}`),
  });
export const inboxOptions = () =>
  queryOptions({
    queryKey: vocabularyKeys.inbox(),
    queryFn: () => fetchJson<InboxData>('/api/vocabulary/field-utterances'),
  });
export const testSetOptions = () =>
  queryOptions({
    queryKey: vocabularyKeys.testSet(),
    queryFn: () => fetchJson<TestSetSummary>('/api/vocabulary/test-set'),
  });

export function useOpenDraftMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => fetchJson<VersionDetail>('/api/vocabulary/versions', { method: 'POST', json: {} }),
    onSuccess: (v) => {
      qc.setQueryData(vocabularyKeys.version(v.id), v);
      return qc.invalidateQueries({ queryKey: vocabularyKeys.versions() });
    },
  });
}

export function useSaveDraftMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { grammar: Grammar; label?: string; baseUpdatedAt?: string }) =>
      fetchJson<VersionDetail>(`/api/vocabulary/versions/${id}`, { method: 'PUT', json: body }),
    onSuccess: (v) => {
      qc.setQueryData(vocabularyKeys.version(id), v);
      return qc.invalidateQueries({ queryKey: vocabularyKeys.versions() });
    },
  });
}

export function useAddPhraseMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: AddPhraseBody) =>
      fetchJson<AddPhraseResult>(`/api/vocabulary/versions/${id}/phrases`, { method: 'POST', json: body }),
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: vocabularyKeys.inbox() }),
        qc.invalidateQueries({ queryKey: vocabularyKeys.version(id) }),
      ]),
  });
}

export function useDismissUtterancesMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (ids: string[]) =>
      fetchJson<{ resolved: number }>('/api/vocabulary/field-utterances', { method: 'PATCH', json: { ids } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: vocabularyKeys.inbox() }),
  });
}

export function useBenchMutation() {
  return useMutation({
    mutationFn: (body: BenchBody) => fetchJson<BenchResult>('/api/vocabulary/bench', { method: 'POST', json: body }),
  });
}

export function useEvaluationMutation(id: string) {
  return useMutation({
    mutationFn: () => fetchJson<EvaluationReport>(`/api/vocabulary/versions/${id}/evaluation`, { method: 'POST' }),
  });
}

export function usePublishMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PublishBody) =>
      fetchJson<PublishResult>(`/api/vocabulary/versions/${id}/publish`, { method: 'POST', json: body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: vocabularyKeys.all }),
  });
}

export function useSaveTestSetMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SaveTestSetBody) =>
      fetchJson<TestSetSummary>('/api/vocabulary/test-set', { method: 'PUT', json: body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: vocabularyKeys.testSet() }),
  });
}

export function useImportGrammarMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ImportGrammarBody) =>
      fetchJson<{ version: VersionDetail; files: string[] }>('/api/vocabulary/import', { method: 'POST', json: body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: vocabularyKeys.all }),
  });
}
