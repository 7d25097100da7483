import { HydrationBoundary, QueryClient, dehydrate } from '@tanstack/react-query';
import { notFound } from 'next/navigation';
import { requireRole } from '@/lib/auth/guards';
import { AppError } from '@/lib/errors';
import { defectKeys } from '@/lib/queries/defects';
import { idSchema } from '@/lib/schemas/common';
import { getDefectOrThrow } from '@/lib/services/defects/get-defect-or-throw';
import { DefectClient } from './defect-client';

export const metadata = { title: 'Defect' };

export default async function DefectPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requireRole('mechanic', 'supervisor');
  const id = idSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const qc = new QueryClient();
  try {
    qc.setQueryData(defectKeys.detail(id.data), await getDefectOrThrow({ fleetId: user.fleetId, id: id.data }));
  } catch (e) {
    if (e instanceof AppError && e.code === 'not_found') notFound();
    throw e;
  }
  return (
    <HydrationBoundary state={dehydrate(qc)}>
      <DefectClient
        id={id.data}
        userName={user.name ?? ''}
        canCertify={user.roles.includes('mechanic')}
        canOpenReport={user.roles.includes('supervisor')}
      />
    </HydrationBoundary>
  );
}
