// The usual cautions, shown at the zones where the work can hurt someone. Sources beside each;
// local regulations and the carrier's licensed maintenance practice decide.

export type Caution = { text: string; source: string };

const chocks: Caution = {
  text: 'Park level, set the spring brakes and chock the wheels before you walk around.',
  source: 'MTO Official Air Brake Handbook',
};

export const zoneCautions: Record<string, Caution[]> = {
  front: [chocks],
  engine_bay: [
    { text: 'Engine off and the key in your pocket before you reach into the engine bay.', source: 'CDL manual §6.4' },
    { text: 'Never open the radiator cap on a hot engine.', source: 'CDL skills manual' },
  ],
  driver_side_tractor: [
    {
      text: 'A damaged or under-inflated rim can burst: stay out of its path and never reinflate a tire that ran flat.',
      source: '29 CFR 1910.177',
    },
    {
      text: 'Check pushrod travel only with the wheels chocked; never go under a unit held up only by air suspension or jacks.',
      source: 'common practice, no published source',
    },
  ],
  coupling: [
    {
      text: 'Never go under the trailer or between the units held up only by air suspension or the landing gear. Use a flashlight for the jaws.',
      source: 'HSE air-suspension alert; Manitoba commercial driving manual',
    },
    {
      text: 'Keep clear of whipping air lines; glad hands hold up to about 125–150 psi.',
      source: 'CDL manual §5.3; handling is common practice',
    },
  ],
  driver_side_trailer: [
    {
      text: 'Brake drums and hubs can burn right after a trip. Stay out of a damaged rim’s path.',
      source: 'CDL skills manual; 29 CFR 1910.177',
    },
  ],
  rear: [
    {
      text: 'At a dock, brakes set and wheels chocked before a forklift boards the trailer.',
      source: '29 CFR 1910.178(k)(1)',
    },
  ],
  passenger_side_trailer: [
    {
      text: 'Brake drums and hubs can burn right after a trip. Stay out of a damaged rim’s path.',
      source: 'CDL skills manual; 29 CFR 1910.177',
    },
  ],
  passenger_side_tractor: [
    {
      text: 'Open air-tank drains slowly, face clear; drain them daily so they do not freeze.',
      source: 'CDL manual §5.1; common practice',
    },
  ],
  in_cab: [{ text: 'Three points of contact getting in and out; face the cab, never jump.', source: 'CDL manual §11' }],
  air_brake_tests: [
    chocks,
    {
      text: 'Tanks hold up to about 150 psi. Release the brakes only with the wheels chocked.',
      source: 'CDL manual §5.3',
    },
  ],
};

export const cautionFooter =
  'Local regulations and your carrier’s licensed maintenance practice decide what may be driven.';
