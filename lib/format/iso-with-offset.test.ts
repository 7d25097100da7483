import { describe, expect, it } from 'vitest';
import { isoWithOffset } from './iso-with-offset';

describe('isoWithOffset (ISO 8601 with the UTC offset, IANA time zones)', () => {
  it('Chicago in December is UTC−6, in July UTC−5 (daylight time)', () => {
    expect(isoWithOffset('2026-12-02T11:46:00Z', 'America/Chicago')).toBe('2026-12-02T05:46:00-06:00');
    expect(isoWithOffset('2026-07-02T11:46:00Z', 'America/Chicago')).toBe('2026-07-02T06:46:00-05:00');
  });
  it('a half-hour zone, UTC itself, and the same instant either way', () => {
    expect(isoWithOffset('2026-12-02T11:46:30Z', 'America/St_Johns')).toBe('2026-12-02T08:16:30-03:30');
    expect(isoWithOffset('2026-12-02T11:46:00Z', 'UTC')).toBe('2026-12-02T11:46:00+00:00');
    const s = isoWithOffset('2026-03-08T08:30:00Z', 'America/Chicago'); // just after the spring change
    expect(new Date(s).toISOString()).toBe('2026-03-08T08:30:00.000Z');
  });
});
