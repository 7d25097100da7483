'use client';

import { useQuery } from '@tanstack/react-query';
import { versionListOptions, versionOptions } from '@/lib/queries/vocabulary';

/** The fleet's open draft and newest published version, with their grammars when asked. */
export function useVersions({ withGrammar = false }: { withGrammar?: boolean } = {}) {
  const list = useQuery(versionListOptions());
  const versions = list.data?.versions ?? [];
  const draftSummary = versions.find((v) => v.status === 'draft') ?? null;
  const publishedSummary = versions.find((v) => v.status === 'published') ?? null;
  const draft = useQuery({ ...versionOptions(draftSummary?.id ?? 'none'), enabled: withGrammar && !!draftSummary });
  return {
    list,
    versions,
    draftSummary,
    publishedSummary,
    draft: draftSummary ? (draft.data ?? null) : null,
    draftLoading: withGrammar && !!draftSummary && draft.isPending,
  };
}
