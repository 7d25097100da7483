import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/guards';
import { getAdminSummary } from '@/lib/services/people/get-admin-summary';
import { AdminOverview } from './admin-overview';

export const metadata: Metadata = { title: 'Administration' };

export default async function AdminHomePage() {
  const user = await requireRole('admin');
  const summary = await getAdminSummary({ fleetId: user.fleetId });
  return <AdminOverview summary={summary} />;
}
