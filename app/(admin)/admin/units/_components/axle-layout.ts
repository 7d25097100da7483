// The axle editor's working state and its conversion to the API's axle layout.
import type { AxlePosition, BrakeChamberType, UnitKind } from '@/lib/schemas/units';
import type { TirePressureTargets } from '@/lib/schemas/fleet';

export type AxleDraft = {
  key: string;
  position: AxlePosition;
  tireCount: 2 | 4;
  tires: string[];
  coldPsi: string;
  chamber: BrakeChamberType | '';
};

let counter = 0;
export const draftKey = () => `axle-${(counter += 1)}`;

/** Tire position names: LF/RF on a steer axle in front, else side + axle number (+ outer/inner). */
export function tireLabels(position: AxlePosition, index: number, count: 2 | 4): string[] {
  if (position === 'steer' && index === 0 && count === 2) return ['LF', 'RF'];
  const n = index + 1;
  return count === 2 ? [`L${n}`, `R${n}`] : [`L${n}O`, `L${n}I`, `R${n}I`, `R${n}O`];
}

export function makeAxle(
  position: AxlePosition,
  index: number,
  targets: TirePressureTargets,
  over: Partial<AxleDraft> = {},
): AxleDraft {
  const tireCount = over.tireCount ?? (position === 'steer' ? 2 : 4);
  return {
    key: draftKey(),
    position,
    tireCount,
    tires: tireLabels(position, index, tireCount),
    coldPsi: String(targets[position]),
    chamber: position === 'steer' ? '24' : '30L',
    ...over,
  };
}

export type LayoutTemplate = { label: string; kind: UnitKind; positions: AxlePosition[] };

export const layoutTemplates: LayoutTemplate[] = [
  { label: '3-axle tractor (tandem drive)', kind: 'tractor', positions: ['steer', 'drive', 'drive'] },
  { label: '2-axle tractor', kind: 'tractor', positions: ['steer', 'drive'] },
  { label: '2-axle trailer (tandem)', kind: 'trailer', positions: ['trailer', 'trailer'] },
  { label: '1-axle trailer', kind: 'trailer', positions: ['trailer'] },
];

export const fromTemplate = (t: LayoutTemplate, targets: TirePressureTargets) =>
  t.positions.map((p, i) => makeAxle(p, i, targets));

/** Remove one axle; the axles behind it move up and get their tire names renumbered. */
export function removeAxle(axles: AxleDraft[], index: number): AxleDraft[] {
  return axles
    .filter((_, j) => j !== index)
    .map((a, k) => (k >= index ? { ...a, tires: tireLabels(a.position, k, a.tireCount) } : a));
}
