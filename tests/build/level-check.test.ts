/** The level check: the input divider of CHECKS.md to the millivolt and the indicator stage to the microamp. */
import { describe, expect, it } from 'vitest';
import { BUILD_FAMILIES, buildSheet, indicatorCheck, levelCheck, parseOhms } from '../../shared/build';
import { gates } from './boards';

const TUBE = BUILD_FAMILIES['tube-drl-nor'].level!;

describe('levelCheck: the tube input divider', () => {
  it('gives −4.8 V with all inputs low and +9.2 V open-circuit, clamped near 0 V, with one high', () => {
    // CHECKS.md input divider (common practice, no source): input node through 22 kΩ to the grid, 33 kΩ to −12 V,
    // logic high +24 V less a 0.7 V diode drop. All low: (0·33 + (−12)·22)/55 = −4.8 V.
    // One high: (23.3·33 − 12·22)/55 = 9.18 V open-circuit, clamped near 0 V by grid current.
    const r = levelCheck(TUBE);
    expect(r.low.grid).toBeCloseTo(-4.8, 3);
    expect(r.high.openCircuit).toBeCloseTo((23.3 * 33 - 12 * 22) / 55, 3);
    expect(r.high.openCircuit).toBeCloseTo(9.18, 3);
    expect(r.high.clamped).toBe(true);
    expect(r.high.grid).toBeCloseTo(0, 3);
    // against the 6AU6 cutoff of about −1 to −2 V (from memory): off below −2 V, conducting above −1 V
    expect(r.low.margin).toBeCloseTo(2.8, 3);
    expect(r.high.margin).toBeCloseTo(1.0, 3);
    expect(r.pass).toBe(true);
  });

  it('warns when the divider no longer cuts the tube off', () => {
    // 100 kΩ to −12 V against 22 kΩ: (0·100 − 12·22)/122 = −2.164 V — still off, barely; 220 kΩ: −1.0 V — not off.
    expect(levelCheck(TUBE, { R2: 100_000 }).low.grid).toBeCloseTo(-12 * 22 / 122, 3);
    const weak = levelCheck(TUBE, { R2: 220_000 });
    expect(weak.low.grid).toBeCloseTo(-12 * 22 / 242, 3);
    expect(weak.low.pass).toBe(false);
    expect(weak.pass).toBe(false);
  });

  it('reads builders\' resistor notation', () => {
    // RKM code (IEC 60062): 4k7 = 4.7 kΩ, 1M = 1 MΩ, 470R = 470 Ω
    expect([parseOhms('22k'), parseOhms('4k7'), parseOhms('4.7k'), parseOhms('1M'), parseOhms('470R'), parseOhms('470')]).toEqual([22_000, 4_700, 4_700, 1_000_000, 470, 470]);
    expect(parseOhms('abc')).toBeNaN();
  });

  it('is the build sheet\'s levelCheck, with --set values', () => {
    const sheet = buildSheet(gates(1, 'nor', 'tube-drl-nor'), 'tube-drl-nor', { set: 'R1=22k,R2=33k,VN=-12' });
    expect(sheet.levelCheck).toMatchObject({ low: { grid: -4.8 }, high: { grid: 0 }, pass: true });
    expect(buildSheet(gates(1, 'nor', 'ttl-74ls'), 'ttl-74ls').levelCheck).toBeUndefined();
  });
});

describe('indicatorCheck: plate → series resistor → LED with a shunt', () => {
  it('gives the LED current by Ohm\'s law to the microamp', () => {
    // CHECKS.md indicator stage (common practice, no source): I = (V_plate − V_f)/R_series − V_f/R_shunt.
    // 24 V plate, 10 kΩ series, 4.7 kΩ shunt, 2.0 V LED: 22/10000 − 2/4700 = 2.2 mA − 0.425532 mA = 1.774468 mA.
    const r = indicatorCheck({ VP: 24, VPL: 2, RS: 10_000, RSH: 4_700, VF: 2 });
    expect(r.onMa).toBeCloseTo(1.774468, 6);
    // plate low at 2 V: 2·4.7/14.7 = 0.639 V across the LED, below V_f: dark
    expect(r.offVolts).toBeCloseTo(2 * 4.7 / 14.7, 6);
    expect(r.offMa).toBe(0);
    expect(r.pass).toBe(true);
    // a shunt so small that the plate's high cannot reach V_f: 24·100/10100 = 0.238 V, the LED stays dark
    expect(indicatorCheck({ VP: 24, VPL: 2, RS: 10_000, RSH: 100, VF: 2 }).onMa).toBe(0);
  });
});
