/**
 * Build-sheet figures are the datasheet values of CHECKS.md times the counts: packing, supply current,
 * delays along the critical path, heater current; plus fan-out warnings, unused inputs and bad input.
 */
import { describe, expect, it } from 'vitest';
import { BuildError, buildSheet } from '../../shared/build';
import { chain, gates, tubeLogicUnit } from './boards';

describe('buildSheet: packages', () => {
  it('packs 9 NAND gates on 7400s into 3 packages with 3 spare gates', () => {
    // Gates per package: 7400 holds 4 NAND (datasheets, CHECKS.md): ceil(9 / 4) = 3.
    const sheet = buildSheet(gates(9, 'nand', 'ttl-74ls'), 'ttl-74ls');
    expect(sheet.devices.packages).toEqual([expect.objectContaining({ name: '74LS00', used: 9, packages: 3, spare: 3 })]);
    // SN74LS00 (TI SDLS025): I_CCH 0.8 typ, I_CCL 2.4 typ, I_CCL 4.4 max mA per package of 4 gates.
    expect(sheet.supply.typicalMa).toBeCloseTo(3 * (0.8 + 2.4) / 2, 9);
    expect(sheet.supply.maxMa).toBeCloseTo(3 * 4.4, 9);
    const cmos = buildSheet(gates(9, 'nor', 'cmos-4000b'), 'cmos-4000b');
    // 4001 holds 4 NOR (datasheets, CHECKS.md); CD4001BC I_DD max 1 µA per package at 5 V (National datasheet).
    expect(cmos.devices.packages).toEqual([expect.objectContaining({ name: '4001B', packages: 3 })]);
    expect(cmos.supply.maxMa).toBeCloseTo(3 * 0.001, 12);
    // C_PD 14 pF per gate (National CD4001BC): I = C·V·f = 9 × 14 pF × 5 V × 1 MHz = 0.63 mA (Ohm's law for capacitors, common practice)
    expect(cmos.supply.dynamicMaPerMHz).toBeCloseTo(9 * 14e-12 * 5 * 1e6 * 1000, 9);
  });
});

describe('buildSheet: critical path', () => {
  it('a chain of N gates has critical path N·t_pd and allows 1/(N·t_pd)', () => {
    for (const n of [1, 4, 9]) {
      // 74HC00 (Philips datasheet, Dec 1990): t_pd typ 7 ns at 5 V.
      const hc = buildSheet(chain(n, 'nand', 'cmos-74hc'), 'cmos-74hc');
      expect(hc.criticalPath?.levels).toBe(n);
      expect(hc.criticalPath?.delayNs).toBeCloseTo(n * 7, 9);
      expect(hc.maxClockHz?.typical).toBeCloseTo(1e9 / (n * 7), 2);
      expect(hc.criticalPath?.parts).toEqual(['a', ...Array.from({ length: n }, (_, i) => `g${i}`), 'y']);
      // CD4001B (National CD4001BC, C_L = 50 pF): t_PHL 120 typ / 250 max ns at 5 V, 50 / 100 at 10 V.
      const cd = buildSheet(chain(n, 'nor', 'cmos-4000b'), 'cmos-4000b');
      expect([cd.criticalPath?.delayNs, cd.criticalPath?.maxDelayNs]).toEqual([120 * n, 250 * n]);
      const cd10 = buildSheet(chain(n, 'nor', 'cmos-4000b'), 'cmos-4000b', { set: 'VDD=10' });
      expect([cd10.criticalPath?.delayNs, cd10.criticalPath?.maxDelayNs]).toEqual([50 * n, 100 * n]);
    }
  });
});

describe('buildSheet: tubes', () => {
  it('heater current of N tubes is N × 0.3 A for the 6AU6', () => {
    // 6AU6 heater 6.3 V, 0.3 A (tube data tables, CHECKS.md).
    for (const n of [1, 5, 12]) {
      const sheet = buildSheet(gates(n, 'nor', 'tube-drl-nor'), 'tube-drl-nor');
      expect(sheet.devices.tubes).toBe(n);
      expect(sheet.heater).toMatchObject({ tube: '6AU6', tubes: n, volts: 6.3, ampsEach: 0.3 });
      expect(sheet.heater!.amps).toBeCloseTo(n * 0.3, 9);
      expect(sheet.heater!.watts).toBeCloseTo(n * 0.3 * 6.3, 9);
      // a diode per input (common practice, no source): two per two-input NOR
      expect(sheet.parts.find((p) => p.item === 'diode')?.quantity).toBe(2 * n);
      expect(sheet.caution).toMatch(/local electrical codes/);
    }
  });

  it('counts the logic unit: eight tubes, 2.4 A of heater, the level check and a parts list by value', () => {
    const sheet = buildSheet(tubeLogicUnit().board, 'tube-drl-nor');
    expect(sheet.gateCount).toBe(8);
    expect(sheet.devices.tubes).toBe(8);
    expect(sheet.heater?.amps).toBeCloseTo(2.4, 9);
    expect(sheet.parts.find((p) => p.name === 'resistor 22 kΩ')?.quantity).toBe(8);
    expect(sheet.parts.find((p) => p.item === 'led')?.quantity).toBe(4);
    expect(sheet.levelCheck?.pass).toBe(true);
    expect(sheet.warmUpS).toBeGreaterThan(0);
    // with the tube family's typical 400 ns per gate (shared/sim FAMILIES), the path's levels times t_pd
    expect(sheet.criticalPath!.delayNs).toBe(sheet.criticalPath!.levels * 400);
  });

  it('builds each NAND gate from two NOR tubes when the switches give complements', () => {
    // NAND from NOR gates, complements available: 2 gates (CHECKS.md minimum counts; Wikipedia "NOR logic")
    const nand = buildSheet(gates(3, 'nand', 'tube-drl-nor'), 'tube-drl-nor');
    expect(nand.builtAs).toMatchObject({ to: 'nor', gates: 6, inverters: 3 });
    expect(nand.devices.tubes).toBe(6);
    expect(nand.heater!.amps).toBeCloseTo(6 * 0.3, 9);
  });
});

describe('buildSheet: warnings and bad input', () => {
  it('warns when a gate drives more loads than the family allows and lists open inputs', () => {
    // SN74LS00 (TI SDLS025): I_OL 8 mA / I_IL 0.4 mA = fan-out 20 LS loads.
    const board = gates(21, 'nand', 'ttl-74ls');
    const fed = { ...board, parts: [...board.parts.filter((p) => p.id !== 'a'), { id: 'drv', kind: 'not' as const, x: 0, y: 0 }, { id: 'a', kind: 'switch' as const, label: 'A', x: -80, y: 0, on: false }],
      wires: [...board.wires.map((w) => (w.from === 'a.out' ? { ...w, from: 'drv.out' } : w)), { id: 'wa', from: 'a.out', to: 'drv.in0' }] };
    const sheet = buildSheet(fed, 'ttl-74ls');
    expect(sheet.fanOut.limit).toBe(20);
    expect(sheet.fanOut.warnings).toEqual([{ net: 'drv_out', driver: 'drv.out', loads: 21, limit: 20 }]);
    const open = { ...board, wires: board.wires.filter((w) => w.id !== 'b0') };
    const advice = buildSheet(open, 'cmos-74hc').unusedInputs;
    expect(advice.pins).toEqual(['g0.in1']);
    // CMOS inputs must never float (TI application report SCBA004)
    expect(advice.source).toBe('TI application report SCBA004');
  });

  it('refuses an unknown family, impossible resistor values and VDD off the datasheet', () => {
    const board = gates(1, 'nor', 'ideal');
    expect(() => buildSheet(board, 'valve-magic')).toThrow(BuildError);
    expect(() => buildSheet(board, 'valve-magic')).toThrow(/unknown family "valve-magic"/);
    for (const bad of ['R1=0', 'R1=-22k', 'R2=abc', 'RS=4k7k']) expect(() => buildSheet(board, 'tube-drl-nor', { set: bad })).toThrow(/impossible resistor value/);
    expect(() => buildSheet(board, 'tube-drl-nor', { set: 'VX=3' })).toThrow(/unknown value VX/);
    expect(() => buildSheet(board, 'cmos-4000b', { set: 'VDD=12' })).toThrow(/5, 10 or 15 V/);
  });
});
