import { NavTabs, type NavTab } from '@/components/ui/tabs';

export type OfficeNavItem = NavTab;

/** The office screens' own tab strip, under the app header; the current screen is marked. */
export function OfficeNav({ items, label }: { items: OfficeNavItem[]; label: string }) {
  return <NavTabs items={items} label={label} className="-mt-2 mb-5 border-b-2 border-edge/20 pb-2" />;
}
