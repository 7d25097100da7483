import { HydrationBoundary, QueryClient, dehydrate } from '@tanstack/react-query';
import { notFound } from 'next/navigation';
import { requireRole } from '@/lib/auth/guards';
import { AppError } from '@/lib/errors';
import { reportKeys } from '@/lib/queries/reports';
import { idSchema } from '@/lib/schemas/common';
import { getReportDetail } from '@/lib/services/reports/get-report-detail';
import { ReportClient } from './report-client';

export const metadata = { title: 'Report' };

export default async function ReportPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requireRole('supervisor');
  const id = idSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const qc = new QueryClient();
  try {
    qc.setQueryData(reportKeys.detail(id.data), await getReportDetail({ fleetId: user.fleetId, id: id.data }));
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') notFound();
    throw e;
  }
  return (
    <HydrationBoundary state={dehydrate(qc)}>
      <ReportClient id={id.data} />
    </HydrationBoundary>
  );
}
