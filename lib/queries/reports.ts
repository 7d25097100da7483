import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { fetchJson } from '@/lib/http/fetch-json';
import type { ListReportsQuery, ReportDetail, ReportPage, ReviewReportBody } from '@/lib/schemas/reports';

export type ReportListParams = Partial<Record<keyof ListReportsQuery, string | number>>;

export const reportKeys = {
  all: ['reports'] as const,
  lists: () => [...reportKeys.all, 'list'] as const,
  list: (params: ReportListParams) => [...reportKeys.lists(), params] as const,
  details: () => [...reportKeys.all, 'detail'] as const,
  detail: (id: string) => [...reportKeys.details(), id] as const,
};

/** The query string of a filter set, without empty values (also the page's URL state). */
export function toReportSearch(params: ReportListParams): string {
  const sp = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== '' && v !== null) sp.set(k, String(v));
  return sp.toString();
}

const listKeys = [
  'from',
  'to',
  'driverId',
  'unitId',
  'kind',
  'hasDefects',
  'short',
  'status',
  'page',
  'pageSize',
  'sort',
  'dir',
] as const;

/** The reports table's state is the URL's query string: shareable, and the back button works. */
export function paramsFromSearch(sp: URLSearchParams): ReportListParams {
  const p: ReportListParams = {};
  for (const k of listKeys) {
    const v = sp.get(k);
    if (v) p[k] = v;
  }
  return p;
}

export const reportListOptions = (params: ReportListParams) =>
  queryOptions({
    queryKey: reportKeys.list(params),
    queryFn: () => fetchJson<ReportPage>(`/api/reports?${toReportSearch(params)}`),
    placeholderData: (previous) => previous,
  });

export const reportDetailOptions = (id: string) =>
  queryOptions({ queryKey: reportKeys.detail(id), queryFn: () => fetchJson<ReportDetail>(`/api/reports/${id}`) });

export function useReviewReportMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ReviewReportBody) =>
      fetchJson<{ id: string; reviewedAt: string; reviewNote: string | null }>(`/api/reports/${id}/review`, {
        method: 'POST',
        json: body,
      }),
    onSuccess: async () => {
      await Promise.all([
        qc.invalidateQueries({ queryKey: reportKeys.detail(id) }),
        qc.invalidateQueries({ queryKey: reportKeys.lists() }),
      ]);
    },
  });
}

export function useNotifyShopMutation(id: string) {
  return useMutation({
    mutationFn: () =>
      fetchJson<{ sent: { unitNumber: string; kind: string; sent: boolean }[] }>(`/api/reports/${id}/notify`, {
        method: 'POST',
      }),
  });
}
