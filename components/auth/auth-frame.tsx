import type { ReactNode } from 'react';

/** The narrow frame of the sign-in, change-password and reset pages. */
export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-6 px-5 py-8">
      <p className="text-3xl font-extrabold tracking-tight">
        Rig<span className="rounded bg-vest px-1 text-on-vest">Call</span>
      </p>
      <h1 className="text-4xl font-extrabold">{title}</h1>
      {children}
    </main>
  );
}
