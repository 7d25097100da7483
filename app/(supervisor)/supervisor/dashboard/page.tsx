import { requireRole } from '@/lib/auth/guards';
import { getOfficeDashboard } from '@/lib/services/reports/get-office-dashboard';
import { DashboardCharts } from './dashboard-charts';

export const metadata = { title: 'Trends' };

export default async function DashboardPage() {
  const user = await requireRole('supervisor');
  const data = await getOfficeDashboard({ fleetId: user.fleetId });
  return (
    <section className="space-y-4">
      <h1 className="text-3xl font-extrabold">Trends</h1>
      <DashboardCharts data={data} />
    </section>
  );
}
