import { describe, expect, it } from 'vitest';
import { safeNext, signInPath } from './safe-next';

describe('safeNext', () => {
  it('keeps a path inside the app', () => {
    expect(safeNext('/invitations/abc?x=1')).toBe('/invitations/abc?x=1');
  });

  it('refuses addresses that leave the site', () => {
    expect(safeNext('https://elsewhere.example/')).toBe('/boards');
    expect(safeNext('//elsewhere.example/')).toBe('/boards');
    expect(safeNext('/\\elsewhere.example')).toBe('/boards');
    expect(safeNext(null, '/x')).toBe('/x');
  });

  it('builds a sign-in address that returns here', () => {
    expect(signInPath('/invitations/a b')).toBe('/signin?next=%2Finvitations%2Fa%20b');
    expect(signInPath('/boards/3', '/signup')).toBe('/signup?next=%2Fboards%2F3');
  });
});
