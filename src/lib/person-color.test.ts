import { describe, expect, it } from 'vitest';
import { PERSON_COLORS, personColor } from './person-color';

describe('personColor', () => {
  it('gives one palette colour per user id, the same for a number or its string', () => {
    expect(personColor(7)).toBe(personColor('7'));
    expect(PERSON_COLORS).toContain(personColor('guest-12'));
    const seen = new Set(Array.from({ length: 40 }, (_, i) => personColor(i)));
    expect(seen.size).toBeGreaterThan(4);
  });
});
