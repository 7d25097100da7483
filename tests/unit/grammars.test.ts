import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  commandsSchema,
  grammarSchema,
  numbersSchema,
  positionsSchema,
  vocabularySchema,
  zonesSchema,
} from '@/lib/schemas/grammar';

const dir = new URL('../../grammars/', import.meta.url);
const load = (name: string): unknown => JSON.parse(readFileSync(new URL(name, dir), 'utf8'));
const schemas = {
  'vocabulary.json': vocabularySchema,
  'commands.json': commandsSchema,
  'positions.json': positionsSchema,
  'numbers.json': numbersSchema,
  'zones.json': zonesSchema,
} as const;

const findDuplicates = (ids: string[]) => ids.filter((id, i) => ids.indexOf(id) !== i);

describe('grammars/', () => {
  it('holds exactly the known grammar files', () => {
    expect(
      readdirSync(dir)
        .filter((f) => f.endsWith('.json'))
        .sort(),
    ).toEqual(Object.keys(schemas).sort());
  });

  it.each(Object.entries(schemas))('%s parses with its schema and carries a version', (name, schema) => {
    const data = schema.parse(load(name));
    expect(data.version).toBeGreaterThanOrEqual(1);
  });

  const vocabulary = vocabularySchema.parse(load('vocabulary.json'));
  const zones = zonesSchema.parse(load('zones.json'));
  const commands = commandsSchema.parse(load('commands.json'));
  const positions = positionsSchema.parse(load('positions.json'));

  it('has unique ids everywhere', () => {
    expect(findDuplicates(vocabulary.systems.map((s) => s.id))).toEqual([]);
    expect(findDuplicates(vocabulary.components.map((c) => c.id))).toEqual([]);
    expect(findDuplicates(vocabulary.conditions.map((c) => c.id))).toEqual([]);
    expect(findDuplicates(commands.commands.map((c) => c.id))).toEqual([]);
    expect(findDuplicates(positions.positions.map((p) => p.id))).toEqual([]);
    expect(findDuplicates(zones.zones.map((z) => z.id))).toEqual([]);
    expect(findDuplicates(zones.zones.flatMap((z) => z.items.map((i) => i.id)))).toEqual([]);
    for (const c of vocabulary.components) expect(findDuplicates(c.defects.map((d) => d.condition)), c.id).toEqual([]);
  });

  it('references only ids that exist', () => {
    const systems = new Set(vocabulary.systems.map((s) => s.id));
    const conditions = new Set(vocabulary.conditions.map((c) => c.id));
    const components = new Set(vocabulary.components.map((c) => c.id));
    for (const c of vocabulary.components) {
      expect(systems.has(c.system), c.id).toBe(true);
      for (const d of c.defects) expect(conditions.has(d.condition), `${c.id}:${d.condition}`).toBe(true);
    }
    for (const z of zones.zones) for (const i of z.items) expect(components.has(i.component), i.id).toBe(true);
  });

  it('covers the systems of a daily tractor-trailer inspection', () => {
    const ids = vocabulary.systems.map((s) => s.id);
    for (const id of [
      'air_brakes',
      'cab_glass',
      'mirrors',
      'wipers_washers',
      'horn',
      'heater_defroster',
      'lamps_reflectors',
      'steering',
      'suspension',
      'tires',
      'wheels_hubs_fasteners',
      'frame_body',
      'coupling',
      'landing_gear',
      'exhaust',
      'fuel',
      'engine_bay',
      'doors_latches',
      'cargo_securement',
      'emergency_equipment',
      'seat_belt',
      'abs',
      'rear_impact_guard',
      'mud_flaps',
      'documents_stickers',
    ]) {
      expect(ids).toContain(id);
      expect(
        vocabulary.components.some((c) => c.system === id),
        id,
      ).toBe(true);
    }
  });

  it('has at least 400 distinct phrases and a severity with a source for every pair', () => {
    const phrases = new Set([
      ...vocabulary.components.flatMap((c) => c.phrases),
      ...vocabulary.conditions.flatMap((c) => c.phrases),
      ...commands.commands.flatMap((c) => c.phrases),
    ]);
    expect(phrases.size).toBeGreaterThanOrEqual(400);
    for (const c of vocabulary.components)
      for (const d of c.defects) expect(d.source.length, `${c.id}:${d.condition}`).toBeGreaterThan(5);
  });

  it('keeps the published classes from the NSC Schedule 1 examples', () => {
    // NSC 13 Schedule 1 Part 21 (Ontario MTO handbook): flat tire and a leak that can be felt or heard are major
    const pair = (comp: string, cond: string) =>
      vocabulary.components.find((c) => c.id === comp)?.defects.find((d) => d.condition === cond);
    expect(pair('steer_tire', 'flat')?.severity.ca).toBe('major');
    expect(pair('drive_tire', 'audible_air_leak')?.severity.ca).toBe('major');
    // NSC 13 Schedule 1 Part 1 (copy of the schedule): audible air leak is minor, pushrod stroke over the limit is major
    expect(pair('brake_chamber', 'audible_air_leak')?.severity.ca).toBe('minor');
    expect(pair('pushrod', 'out_of_adjustment')?.severity.ca).toBe('major');
    // NSC 13 Schedule 1 Part 4 (copy of the schedule): coupler locking mechanism that will not lock is major
    expect(pair('fifth_wheel_jaws', 'not_locked')?.severity.ca).toBe('major');
    // NSC 13 Schedule 1 Part 14 (Ontario MTO handbook): mirror defects are minor
    expect(pair('mirror', 'cracked')?.severity.ca).toBe('minor');
  });

  it('orders the walk and gives each configuration its zones', () => {
    expect(zones.zones.map((z) => z.id)).toEqual([
      'front',
      'engine_bay',
      'driver_side_tractor',
      'coupling',
      'driver_side_trailer',
      'rear',
      'passenger_side_trailer',
      'passenger_side_tractor',
      'in_cab',
      'air_brake_tests',
    ]);
    const bobtail = zones.zones.filter((z) => z.configurations.includes('bobtail')).map((z) => z.id);
    expect(bobtail).not.toContain('coupling');
    expect(bobtail).not.toContain('driver_side_trailer');
    for (const z of zones.zones)
      for (const i of z.items)
        expect(
          i.configurations.every((c) => z.configurations.includes(c)),
          i.id,
        ).toBe(true);
  });

  it('forms one grammar object the matcher accepts', () => {
    expect(() =>
      grammarSchema.parse({ vocabulary, commands, positions, numbers: load('numbers.json'), zones }),
    ).not.toThrow();
  });
});
