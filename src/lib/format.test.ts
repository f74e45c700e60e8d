import { describe, expect, it } from 'vitest';
import { formatDateTime, initialsOf } from './format';

describe('initialsOf', () => {
  it('takes the first and last word', () => {
    expect(initialsOf('Ruth Calder')).toBe('RC');
    expect(initialsOf('Ines de la Okafor')).toBe('IO');
  });
  it('takes two letters of a single word or an address', () => {
    expect(initialsOf('theo')).toBe('TH');
    expect(initialsOf('sam.ortiz@room14.example')).toBe('SO');
  });
});

describe('formatDateTime', () => {
  it('shows a dash for nothing and the raw text for an unparsable date', () => {
    expect(formatDateTime(null)).toBe('—');
    expect(formatDateTime('not a date')).toBe('not a date');
  });
  it('formats an ISO time as something with the year in it', () => {
    expect(formatDateTime('2026-03-14T09:26:53Z')).toMatch(/2026/);
  });
});
