import { describe, expect, it } from 'vitest';
import { FAMILY_IDS } from '../../shared/board';
import { FAMILY_LABELS, safetyCautionFor } from './families';

describe('safetyCautionFor', () => {
  // Tube plate supplies of a few hundred volts are lethal and filter capacitors hold their charge
  // after switch-off (common practice, no source); the app defers to local codes and qualified people.
  it('cautions tube builds and defers to local electrical codes', () => {
    const text = safetyCautionFor('tube-drl-nor') ?? '';
    expect(text).toMatch(/kill/);
    expect(text).toMatch(/local electrical codes/);
    expect(text).toMatch(/qualified/);
  });

  it('cautions relay builds about mains supplies', () => {
    expect(safetyCautionFor('relay')).toMatch(/mains/);
  });

  it('stays quiet for low-voltage logic families', () => {
    for (const f of ['ideal', 'rtl', 'dtl', 'ttl-74ls', 'cmos-4000b', 'cmos-74hc'] as const) expect(safetyCautionFor(f)).toBeNull();
  });

  it('names every family of the board file', () => {
    for (const f of FAMILY_IDS) expect(FAMILY_LABELS[f]).toBeTruthy();
  });
});
