import Link from 'next/link';
import { buttonClass } from '@/components/ui/button';

export default function NotAllowedPage() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-xl flex-col justify-center gap-6 px-5">
      <h1 className="text-3xl font-extrabold">This screen is not part of your role</h1>
      <p className="text-xl">Ask your fleet&apos;s admin if you need access. Your own screens are one tap away.</p>
      <Link href="/go" className={buttonClass('primary')}>
        Go to my screens
      </Link>
    </main>
  );
}
