import type { DB } from '../connect';
import { hashPassword, makeFleet, makeUnit, makeUser } from '../factories';
import demo from './demo-people.json' with { type: 'json' };
import type { Role } from '../../lib/auth/roles';
import { computeVinCheckDigit } from '../../lib/schemas/units';

// Model-year codes of the VIN's 10th character (49 CFR 565.15), for the years the demo units use.
const modelYearCode: Record<number, string> = {
  2014: 'E',
  2016: 'G',
  2017: 'H',
  2018: 'J',
  2019: 'K',
  2020: 'L',
  2021: 'M',
  2022: 'N',
  2023: 'P',
  2024: 'R',
};

/**
 * An invented, well-formed VIN: eight characters naming maker and model, the check digit that
 * 49 CFR 565.15 computes from the rest, the model year, a plant letter and a serial number.
 */
export function demoVin(makerAndModel: string, year: number, serial: number): string {
  const draft = `${makerAndModel}0${modelYearCode[year] ?? 'A'}N${String(serial).padStart(6, '0')}`;
  return `${draft.slice(0, 8)}${computeVinCheckDigit(draft)}${draft.slice(9)}`;
}

const tractorAxles = (chamber: string) => [
  { position: 'steer', tires: ['LF', 'RF'], coldPsi: 110, chamber: '24' },
  { position: 'drive', tires: ['LFO', 'LFI', 'RFI', 'RFO'], coldPsi: 100, chamber },
  { position: 'drive', tires: ['LRO', 'LRI', 'RRI', 'RRO'], coldPsi: 100, chamber },
];
const trailerAxles = [
  { position: 'trailer', tires: ['LFO', 'LFI', 'RFI', 'RFO'], coldPsi: 100, chamber: '30L' },
  { position: 'trailer', tires: ['LRO', 'LRI', 'RRI', 'RRO'], coldPsi: 100, chamber: '30L' },
];

// An invented fleet: every company, person, unit and place here is made up.
const tractorList = [
  { unitNumber: '214', make: 'Kestrel', model: 'K70 day cab', year: 2019, plate: 'NB 4471', chamber: '30L' },
  { unitNumber: '231', make: 'Kestrel', model: 'K90 sleeper', year: 2021, plate: 'NB 4488', chamber: '30L' },
  { unitNumber: '247', make: 'Ardent', model: 'A-Line 600', year: 2017, plate: 'NB 3902', chamber: '30' },
  { unitNumber: '252', make: 'Ardent', model: 'A-Line 640', year: 2022, plate: 'NB 5120', chamber: '30L' },
  { unitNumber: '268', make: 'Kestrel', model: 'K70 day cab', year: 2023, plate: 'NB 5377', chamber: '30L' },
];
const trailerList = [
  { unitNumber: '5301', make: 'Plainsman', model: '53 ft dry van', year: 2016, plate: 'TRL 8830' },
  { unitNumber: '5302', make: 'Plainsman', model: '53 ft dry van', year: 2016, plate: 'TRL 8831' },
  { unitNumber: '5315', make: 'Plainsman', model: '53 ft dry van', year: 2019, plate: 'TRL 9104' },
  { unitNumber: '5322', make: 'Coldbrook', model: '53 ft reefer', year: 2020, plate: 'TRL 9260' },
  { unitNumber: '5323', make: 'Coldbrook', model: '53 ft reefer', year: 2020, plate: 'TRL 9261' },
  { unitNumber: '4807', make: 'Plainsman', model: '48 ft flatbed', year: 2014, plate: 'TRL 7718' },
  { unitNumber: '5340', make: 'Plainsman', model: '53 ft dry van', year: 2024, plate: 'TRL 9902' },
  { unitNumber: '5341', make: 'Plainsman', model: '53 ft dry van', year: 2024, plate: 'TRL 9903' },
];

export const demoTractors = tractorList.map((t, i) => ({
  ...t,
  vin: demoVin(t.make === 'Kestrel' ? '3KS7D2TX' : '1AR6L4TX', t.year, 104_200 + i * 377),
}));
export const demoTrailers = trailerList.map((t, i) => ({
  ...t,
  vin: demoVin(t.make === 'Coldbrook' ? '2CB5R532' : '1PL5V532', t.year, 55_100 + i * 211),
}));

export async function seedDemoFleet(db: DB) {
  const fleet = await makeFleet(db, {
    ...demo.fleet,
    maintenanceEmail: 'shop@northbank.example',
    supervisorEmail: 'marcus.lindqvist@northbank.example',
  });
  const passwordHash = await hashPassword(demo.password);
  const people = [];
  for (const p of demo.people)
    people.push(
      await makeUser(db, { fleetId: fleet.id, email: p.email, name: p.name, roles: p.roles as Role[], passwordHash }),
    );
  for (const t of demoTractors) {
    const { chamber, ...rest } = t;
    await makeUnit(db, {
      fleetId: fleet.id,
      kind: 'tractor',
      plateJurisdiction: 'IA',
      axles: JSON.stringify(tractorAxles(chamber)),
      ...rest,
    });
  }
  for (const t of demoTrailers) {
    await makeUnit(db, {
      fleetId: fleet.id,
      kind: 'trailer',
      plateJurisdiction: 'IA',
      axles: JSON.stringify(trailerAxles),
      ...t,
    });
  }
  // A second, unrelated fleet: nobody at Northbank may ever see its records.
  const other = await makeFleet(db, { name: 'Red Mesa Carriers', slug: 'red-mesa', timezone: 'America/Denver' });
  await makeUser(db, {
    fleetId: other.id,
    email: 'ines.duarte@redmesa.example',
    name: 'Ines Duarte',
    roles: ['driver', 'admin'],
    passwordHash,
  });
  await makeUnit(db, {
    fleetId: other.id,
    kind: 'tractor',
    unitNumber: 'RM-11',
    vin: demoVin('1AR6L4TX', 2018, 98_765),
    make: 'Ardent',
    model: 'A-Line 600',
    year: 2018,
  });
  return { fleet, people };
}
