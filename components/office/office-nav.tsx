import Link from 'next/link';

export type OfficeNavItem = { href: string; label: string };

/** The office screens' own tab strip, under the app header. */
export function OfficeNav({ items, label }: { items: OfficeNavItem[]; label: string }) {
  return (
    <nav aria-label={label} className="-mt-2 mb-5 flex flex-wrap gap-1 border-b-2 border-edge/20 pb-2 text-base">
      {items.map((i) => (
        <Link
          key={i.href}
          href={i.href}
          className="rounded-md px-3 py-1.5 font-bold hover:bg-panel hover:underline focus-visible:bg-panel"
        >
          {i.label}
        </Link>
      ))}
    </nav>
  );
}
