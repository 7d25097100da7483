'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useCreateUnitMutation } from '@/lib/queries/admin';
import { UnitForm } from '../_components/unit-form';

export function NewUnitClient() {
  const router = useRouter();
  const create = useCreateUnitMutation();
  return (
    <div className="flex flex-col gap-4">
      <header>
        <Link href="/admin/units" className="text-lg underline underline-offset-4">
          ← All units
        </Link>
        <h1 className="text-3xl font-extrabold">Add a unit</h1>
      </header>
      <UnitForm
        submitLabel="Add this unit"
        onSave={async (body) => {
          const { unit } = await create.mutateAsync(body);
          router.push(`/admin/units?added=${encodeURIComponent(unit.unitNumber)}`);
          return `Unit ${unit.unitNumber} added.`;
        }}
      />
    </div>
  );
}
