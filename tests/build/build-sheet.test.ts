/**
 * Build-sheet figures are the datasheet values of CHECKS.md times the counts: packing, supply current,
 * delays along the critical path, heater current; plus fan-out warnings, unused inputs and bad input.
 */
import { describe, expect, it } from 'vitest';
import { BuildError, buildSheet } from '../../shared/build';
import { driverLevels } from '../../shared/build/fan-out';
import { parseBoardFile } from '../../shared/board';
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
    // the inverter drives 21: two buffers of up to 20 loads each, the inverter then drives those two
    // (switch B, on the 21 gates' other inputs, is warned about too: see the next test)
    expect(sheet.fanOut.warnings.map((w) => w.driver).sort()).toEqual(['b.out', 'drv.out']);
    expect(sheet.fanOut.warnings.find((w) => w.driver === 'drv.out')).toEqual({
      net: 'drv_out', driver: 'drv.out', kind: 'not', loads: 21, limit: 20, drivers: 2, levels: 1,
      advice: 'Buffer it: 2 buffers (driver stages) each feed at most 20 of its 21 loads; the gate then drives 2, or build the gate twice and share the loads between the copies.',
    });
    const open = { ...board, wires: board.wires.filter((w) => w.id !== 'b0') };
    const advice = buildSheet(open, 'cmos-74hc').unusedInputs;
    expect(advice.pins).toEqual(['g0.in1']);
    // CMOS inputs must never float (TI application report SCBA004)
    expect(advice.source).toBe('TI application report SCBA004');
  });

  it('counts the loads of switches, buttons and clocks as a gate\'s, and says how to buffer them; a constant is a rail tie', () => {
    // 21 NAND gates on switch A and B: each switch drives 21 loads, one more than SN74LS00's fan-out of 20
    // (TI SDLS025: I_OL 8 mA / I_IL 0.4 mA); an input is counted like a gate output (common practice, no source)
    const sheet = buildSheet(gates(21, 'nand', 'ttl-74ls'), 'ttl-74ls');
    expect(sheet.fanOut.warnings.map((w) => [w.net, w.driver, w.kind, w.loads, w.drivers, w.levels])).toEqual([['A', 'a.out', 'switch', 21, 2, 1], ['B', 'b.out', 'switch', 21, 2, 1]]);
    expect(sheet.fanOut.warnings[0].advice).toBe('Buffer it: 2 buffers (driver stages) each feed at most 20 of its 21 loads; the switch then drives 2.');
    // within the limit: no warning (20 loads on each switch)
    expect(buildSheet(gates(20, 'nand', 'ttl-74ls'), 'ttl-74ls').fanOut.warnings).toEqual([]);
    // the same board on buttons and on a constant: the button is warned about, the constant is not
    const on = (kind: 'button' | 'const') => ({ ...gates(21, 'nand', 'ttl-74ls'), parts: gates(21, 'nand', 'ttl-74ls').parts.map((p) => (p.id === 'a' ? (kind === 'const' ? { id: 'a', kind, x: 0, y: 0, value: 1 as const } : { id: 'a', kind, label: 'A', x: 0, y: 0, pressed: false }) : p)) });
    expect(buildSheet(on('button'), 'ttl-74ls').fanOut.warnings.map((w) => [w.driver, w.kind])).toEqual([['a.out', 'button'], ['b.out', 'switch']]);
    expect(buildSheet(on('const'), 'ttl-74ls').fanOut.warnings.map((w) => w.driver)).toEqual(['b.out']);
  });

  it('a clock on many flip-flops: a two-level driver tree and a word on clock skew', () => {
    // one clock on 24 D flip-flops in the tube family (fan-out 4, from memory): 24 / 4 = 6 buffers on the
    // loads, 6 / 4 → 2 buffers on those, the clock drives 2 (a driver tree, common practice, no source)
    const parts: unknown[] = [{ id: 'clk', kind: 'clock', label: 'CLK', x: 0, y: 0 }, { id: 'd', kind: 'switch', label: 'D', x: 0, y: 60 }];
    const wires: { id: string; from: string; to: string }[] = [];
    for (let i = 0; i < 24; i++) {
      parts.push({ id: `ff${i}`, kind: 'dff', x: 100, y: 60 * i }, { id: `q${i}`, kind: 'lamp', label: `Q${i}`, x: 200, y: 60 * i });
      wires.push({ id: `c${i}`, from: 'clk.out', to: `ff${i}.clk` }, { id: `q${i}`, from: `ff${i}.q`, to: `q${i}.in` });
      if (i < 4) wires.push({ id: `d${i}`, from: 'd.out', to: `ff${i}.d` });
    }
    const board = parseBoardFile({ format: 'gatefold-board', version: 1, title: 'clocked', family: 'tube-drl-nor', parts, wires });
    if (!board.ok) throw new Error(board.problems.map((p) => p.message).join('; '));
    const sheet = buildSheet(board.board, 'tube-drl-nor');
    expect(sheet.fanOut.limit).toBe(4);
    // the switch D drives 4: within the limit
    expect(sheet.fanOut.warnings).toHaveLength(1);
    expect(sheet.fanOut.warnings[0]).toMatchObject({ net: 'CLK', driver: 'clk.out', kind: 'clock', loads: 24, limit: 4, drivers: 8, levels: 2 });
    expect(sheet.fanOut.warnings[0].advice).toBe('Buffer it: 6 buffers (driver stages) each feed at most 4 of its 24 loads, 2 more feed those 6 (8 in all); the clock then drives 2. '
      + 'Give every flip-flop\'s clock the same number of stages: a branch with more stages clocks later (skew), and a flip-flop clocked late can take its neighbour\'s new value instead of the old one.');
  });

  it('driver tree levels: a buffer per group of the limit, level after level until the source drives at most the limit', () => {
    // ceil(L / F) per level (common practice, no source): 24/4 → 6, 2; 21/20 → 2; 400/20 → 20; 401/20 → 21, 2; 5/4 → 2
    expect(driverLevels(24, 4)).toEqual([6, 2]);
    expect(driverLevels(21, 20)).toEqual([2]);
    expect(driverLevels(400, 20)).toEqual([20]);
    expect(driverLevels(401, 20)).toEqual([21, 2]);
    expect(driverLevels(5, 4)).toEqual([2]);
    expect(driverLevels(4, 4)).toEqual([]);
    expect(driverLevels(100, 4)).toEqual([25, 7, 2]);
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
