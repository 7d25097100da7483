import { Panel } from '@/components/ui/panel';
/** The cautions to read before anyone works on a unit. RigCall records the work; it does not make it safe. */
export function SafetyCautions() {
  return (
    <Panel as="aside" tone="minor" aria-label="Before you work on the unit" className="text-base">
      <p className="mb-2 flex items-center gap-2 font-extrabold">
        <svg
          aria-hidden
          viewBox="0 0 16 16"
          className="h-5 w-5 text-minor"
          fill="none"
          stroke="currentColor"
          strokeWidth="2"
        >
          <path d="M8 1.8L15 14H1z" strokeLinejoin="round" />
          <path d="M8 6v4M8 11.6v.4" />
        </svg>
        Before you work on the unit
      </p>
      <ul className="list-disc space-y-1 pl-6">
        <li>Wheels chocked and spring brakes set.</li>
        <li>
          Engine off and key out of the ignition (keep it with you) before reaching into the engine bay or going under.
        </li>
        <li>Never work under a unit held up only by its air suspension or a jack: use rated stands.</li>
        <li>Spring brake chambers hold a compressed spring: cage them before taking one apart.</li>
        <li>Air tanks and lines are under pressure: drain them before opening a fitting.</li>
      </ul>
      <p className="mt-2 text-muted">
        Local regulations and the carrier&apos;s licensed maintenance practice decide how a repair is done and whether
        the unit may be driven.
      </p>
    </Panel>
  );
}
