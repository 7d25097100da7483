import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { fetchJson } from '@/lib/http/fetch-json';
import type { CertifyRepairBody, DefectDetail } from '@/lib/schemas/defects';
import { reportKeys } from './reports';

export const defectKeys = {
  all: ['defects'] as const,
  details: () => [...defectKeys.all, 'detail'] as const,
  detail: (id: string) => [...defectKeys.details(), id] as const,
};

export const defectDetailOptions = (id: string) =>
  queryOptions({ queryKey: defectKeys.detail(id), queryFn: () => fetchJson<DefectDetail>(`/api/defects/${id}`) });

export type CertifyRepairResult = {
  id: string;
  /** Every defect the signature covered: this one and the rest of its work order. */
  certifiedIds: string[];
  status: 'repaired' | 'no_repair_needed';
  certifiedName: string;
  certifiedAt: string;
  unit: { id: string; unitNumber: string; status: 'in_service' | 'out_of_service'; changed: boolean };
  openMajor: number;
  openMinor: number;
  mailed: boolean;
};

export function useCertifyRepairMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CertifyRepairBody) =>
      fetchJson<CertifyRepairResult>(`/api/defects/${id}/certification`, { method: 'POST', json: body }),
    onSuccess: async () => {
      await Promise.all([
        qc.invalidateQueries({ queryKey: defectKeys.all }),
        qc.invalidateQueries({ queryKey: reportKeys.all }),
      ]);
    },
  });
}
