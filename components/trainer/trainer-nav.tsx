import { OfficeNav } from '@/components/office/office-nav';

const items = [
  { href: '/trainer', label: 'Versions' },
  { href: '/trainer/editor', label: 'Vocabulary editor' },
  { href: '/trainer/bench', label: 'Test bench' },
  { href: '/trainer/inbox', label: 'Field utterances' },
  { href: '/trainer/evaluation', label: 'Evaluate & publish' },
];

/** The trainer screens' tab strip. */
export function TrainerNav() {
  return <OfficeNav items={items} label="Vocabulary screens" />;
}
