import type { SourceStatus } from './types';

/**
 * Steering wheel lash (free play) limits, 49 CFR 393.209(b), measured at the rim with the wheels
 * straight ahead (engine running for power steering).
 *
 * The manual-steering values for 16, 18, 20 and 22 in are verified against the same values in
 * 49 CFR 570.60 Table 2. The 19 and 21 in manual values and the whole power column are FROM
 * MEMORY, UNVERIFIED: correct them through `customizeProfile` (rule ids
 * `steering_lash.manual.<diameter>` / `steering_lash.power.<diameter>`).
 */
export type SteeringLashRow = {
  wheelDiameterIn: number;
  manualIn: number;
  manualStatus: SourceStatus;
  powerIn: number;
  powerStatus: SourceStatus;
};

export const steeringLashTable: readonly SteeringLashRow[] = [
  { wheelDiameterIn: 16, manualIn: 2, manualStatus: 'verified', powerIn: 4.5, powerStatus: 'from-memory' },
  { wheelDiameterIn: 18, manualIn: 2.25, manualStatus: 'verified', powerIn: 4.75, powerStatus: 'from-memory' },
  { wheelDiameterIn: 19, manualIn: 2.375, manualStatus: 'from-memory', powerIn: 5, powerStatus: 'from-memory' },
  { wheelDiameterIn: 20, manualIn: 2.5, manualStatus: 'verified', powerIn: 5.25, powerStatus: 'from-memory' },
  { wheelDiameterIn: 21, manualIn: 2.625, manualStatus: 'from-memory', powerIn: 5.5, powerStatus: 'from-memory' },
  { wheelDiameterIn: 22, manualIn: 2.75, manualStatus: 'verified', powerIn: 5.75, powerStatus: 'from-memory' },
];

/** 393.209(b)(2): for any other wheel diameter, the limit is an angle of wheel rotation. From memory, unverified. */
export const OTHER_DIAMETER_MAX_DEGREES = { manual: 14, power: 30 } as const;

/** Driver rule of thumb (CDL manual): more than 10 degrees makes steering hard. Not a legal limit. */
export const RULE_OF_THUMB_DEGREES = 10;

/** Roadside out-of-service levels (CVSA criteria), from memory, unverified. */
export const OUT_OF_SERVICE_DEGREES = { manual: 30, power: 45 } as const;

/** Lash at the rim, in, for an angle of wheel rotation: π × D × angle / 360. */
export function convertLashAngleToInches(wheelDiameterIn: number, degrees: number): number {
  return (Math.PI * wheelDiameterIn * degrees) / 360;
}

/** Find the table row of a wheel diameter (to the nearest 1/100 in), or undefined for other diameters. */
export function findSteeringLashRow(wheelDiameterIn: number): SteeringLashRow | undefined {
  return steeringLashTable.find((row) => Math.abs(row.wheelDiameterIn - wheelDiameterIn) < 0.005);
}
