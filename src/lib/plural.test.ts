import { describe, expect, it } from 'vitest';
import { plural } from './plural';

describe('plural', () => {
  it('uses the singular for exactly one and the plural otherwise', () => {
    expect(plural(1, 'row')).toBe('1 row');
    expect(plural(0, 'row')).toBe('0 rows');
    expect(plural(2, 'row')).toBe('2 rows');
    expect(plural(1048576, 'row')).toBe('1,048,576 rows');
    expect(plural(3, 'part', 'parts selected')).toBe('3 parts selected');
  });
});
