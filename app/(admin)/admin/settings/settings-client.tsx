'use client';

import { useQuery } from '@tanstack/react-query';
import { FormNotice } from '@/components/ui/field';
import { fleetSettingsQuery } from '@/lib/queries/admin';
import { SettingsForm } from './settings-form';

export function SettingsClient() {
  const { data: fleet, error } = useQuery(fleetSettingsQuery());
  return (
    <div className="flex flex-col gap-4">
      <header>
        <h1 className="text-3xl font-extrabold">Fleet settings</h1>
        <p className="text-lg text-muted">
          {fleet ? `${fleet.name}: how inspections are judged and where alerts go.` : ' '}
        </p>
      </header>
      {error ? <FormNotice kind="error">{error.message}</FormNotice> : null}
      {fleet ? <SettingsForm fleet={fleet} /> : error ? null : <p className="text-lg">Loading…</p>}
    </div>
  );
}
