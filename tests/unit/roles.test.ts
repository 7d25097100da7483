import { describe, expect, it } from 'vitest';
import { findHomeFor, isRole } from '@/lib/auth/roles';

describe('roles', () => {
  it('sends a user to the first view they hold', () => {
    expect(findHomeFor(['driver'])).toBe('/driver');
    expect(findHomeFor(['supervisor', 'driver'])).toBe('/driver');
    expect(findHomeFor(['admin', 'trainer'])).toBe('/trainer');
    expect(findHomeFor([])).toBe('/');
  });
  it('knows the roles and nothing else', () => {
    expect(isRole('mechanic')).toBe(true);
    expect(isRole('root')).toBe(false);
    expect(isRole(3)).toBe(false);
  });
});
