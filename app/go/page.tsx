import { redirect } from 'next/navigation';
import { requireUser } from '@/lib/auth/guards';
import { findHomeFor } from '@/lib/auth/roles';

// After sign-in: straight to the first view the user holds.
export default async function GoPage() {
  const user = await requireUser();
  redirect(findHomeFor(user.roles));
}
