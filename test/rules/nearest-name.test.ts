import { describe, expect, it } from 'vitest';
import { nearestName } from '../../src/rules/nearest-name.js';

const inputs = ['cpa_nm', 'tcpa_min', 'bearing_deg', 'rel_course_deg', 'own_speed_kn'];

describe('nearestName', () => {
  it('suggests a name one or two slips away', () => {
    expect(nearestName('cpa_mn', inputs)).toBe('cpa_nm');
    expect(nearestName('TCPA_min', inputs)).toBe('tcpa_min');
  });

  it('suggests the full name for a name without its unit suffix', () => {
    expect(nearestName('bearing', inputs)).toBe('bearing_deg');
  });

  it('suggests nothing when no name is close', () => {
    expect(nearestName('altitude', inputs)).toBeUndefined();
  });

  it('prefers the smallest distance, then the earlier name', () => {
    expect(nearestName('ab', ['ax', 'ab_c', 'xb'])).toBe('ax');
  });
});
