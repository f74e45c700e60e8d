/**
 * Packages of the chip families: what one package holds and what it draws. Each row names its source.
 * Supply current: TTL as the average of I_CCH and I_CCL (typical) and the larger maximum; CMOS as the
 * quiescent maximum (its dynamic part is C_PD·V·f, see build-sheet).
 */
import { FROM_MEMORY } from './sourced';

/** One package type. */
export interface PackageSpec {
  name: string;
  /** part kind it implements (a gate kind, `not`, `buffer`, a storage kind, `mux2`, `mux4`) */
  kind: string;
  /** inputs per gate, for gate kinds */
  inputs?: number;
  /** gates (elements) in one package */
  perPackage: number;
  /** supply current of one package, mA: typical and maximum */
  supplyMa: { typ: number; max: number };
  source: string;
}

const SDLS025 = 'TI datasheet SDLS025 (SN74LS00: 4 NAND, I_CCH 0.8/1.6 mA, I_CCL 2.4/4.4 mA typ/max)';
const ls = (name: string, kind: string, inputs: number | undefined, perPackage: number, typ: number, max: number, source = FROM_MEMORY): PackageSpec =>
  ({ name, kind, inputs, perPackage, supplyMa: { typ, max }, source });

/** 74LS packages. */
export const TTL_74LS_PACKAGES: PackageSpec[] = [
  ls('74LS00', 'nand', 2, 4, (0.8 + 2.4) / 2, 4.4, SDLS025),
  ls('74LS10', 'nand', 3, 3, 1.2, 3.3),
  ls('74LS20', 'nand', 4, 2, 0.8, 2.2),
  ls('74LS30', 'nand', 8, 1, 0.5, 1.1),
  ls('74LS02', 'nor', 2, 4, 2.2, 5.4, '4 NOR per 7402 (from memory); currents from memory'),
  ls('74LS27', 'nor', 3, 3, 2.7, 6.8),
  ls('74LS04', 'not', undefined, 6, 2.4, 6.6, '6 NOT per 7404 (datasheets, CHECKS.md); LS currents from memory'),
  ls('74LS125', 'buffer', undefined, 4, 11, 20),
  ls('74LS08', 'and', 2, 4, 3.4, 8.8),
  ls('74LS11', 'and', 3, 3, 2.6, 6.6),
  ls('74LS21', 'and', 4, 2, 1.7, 4.4),
  ls('74LS32', 'or', 2, 4, 4.0, 9.8),
  ls('74LS86', 'xor', 2, 4, 6.1, 10, '4 XOR per 7486 (datasheets, CHECKS.md); LS currents from memory'),
  ls('74LS266', 'xnor', 2, 4, 8, 13, '4 XNOR per 74LS266, open-collector outputs need pull-up resistors (from memory)'),
  ls('74LS279', 'srlatch', undefined, 4, 3.8, 7),
  ls('74LS75', 'dlatch', undefined, 4, 6.3, 12),
  ls('74LS74', 'dff', undefined, 2, 4, 8),
  ls('74LS157', 'mux2', undefined, 4, 9.7, 16),
  ls('74LS153', 'mux4', undefined, 2, 6.2, 10),
];

const CD4001 = 'National CD4001BC datasheet: I_DD max 1 µA at 5 V per package';
const cd = (name: string, kind: string, inputs: number | undefined, perPackage: number, iddMaxUa: number, source = FROM_MEMORY): PackageSpec =>
  ({ name, kind, inputs, perPackage, supplyMa: { typ: 0, max: iddMaxUa / 1000 }, source });

/** 4000B packages (quiescent current at 5 V; see CMOS_4000B_SUPPLY for 10 and 15 V). */
export const CMOS_4000B_PACKAGES: PackageSpec[] = [
  cd('4011B', 'nand', 2, 4, 1, '4 NAND per 4011 (datasheets, CHECKS.md); I_DD as the CD4001BC (from memory)'),
  cd('4023B', 'nand', 3, 3, 1), cd('4012B', 'nand', 4, 2, 1), cd('4068B', 'nand', 8, 1, 1),
  cd('4001B', 'nor', 2, 4, 1, `4 NOR per 4001 (datasheets, CHECKS.md); ${CD4001}`),
  cd('4025B', 'nor', 3, 3, 1), cd('4002B', 'nor', 4, 2, 1), cd('4078B', 'nor', 8, 1, 1),
  cd('4069UB', 'not', undefined, 6, 1, '6 NOT per 4069UB (from memory)'),
  cd('4050B', 'buffer', undefined, 6, 1),
  cd('4081B', 'and', 2, 4, 1), cd('4073B', 'and', 3, 3, 1), cd('4082B', 'and', 4, 2, 1),
  cd('4071B', 'or', 2, 4, 1), cd('4075B', 'or', 3, 3, 1), cd('4072B', 'or', 4, 2, 1),
  cd('4070B', 'xor', 2, 4, 1, '4 XOR per 4070 (datasheets, CHECKS.md); I_DD from memory'),
  cd('4077B', 'xnor', 2, 4, 1),
  cd('4043B', 'srlatch', undefined, 4, 4), cd('4042B', 'dlatch', undefined, 4, 4), cd('4013B', 'dff', undefined, 2, 4),
  cd('4019B', 'mux2', undefined, 4, 4), cd('4539B', 'mux4', undefined, 2, 4),
];

/** 4000B figures that change with the supply: delays (ns, typical and maximum) and the quiescent-current factor. */
export const CMOS_4000B_SUPPLY: Record<5 | 10 | 15, { tPHL: { typ: number | null; max: number }; iddFactor: number; source: string }> = {
  // typical at 5 V is the simulator's figure (shared/sim FAMILIES): null here so it lives in one place
  5: { tPHL: { typ: null, max: 250 }, iddFactor: 1, source: 'National CD4001BC datasheet, C_L = 50 pF: t_PHL 120/250 ns, I_DD max 1 µA at 5 V' },
  10: { tPHL: { typ: 50, max: 100 }, iddFactor: 2, source: 'National CD4001BC datasheet, C_L = 50 pF: t_PHL 50/100 ns, I_DD max 2 µA at 10 V' },
  15: { tPHL: { typ: 35, max: 70 }, iddFactor: 4, source: 'National CD4001BC datasheet, C_L = 50 pF: t_PHL 35/70 ns, I_DD max 4 µA at 15 V' },
};

const hc = (name: string, kind: string, inputs: number | undefined, perPackage: number, source = FROM_MEMORY): PackageSpec =>
  ({ name, kind, inputs, perPackage, supplyMa: { typ: 0, max: name.match(/7[45]HC(74|75|157|153|279)$/) ? 0.004 : 0.002 }, source: `${source}; I_CC max 2 µA (gates) or 4 µA at 25 °C (from memory)` });

/** 74HC packages (quiescent current). */
export const CMOS_74HC_PACKAGES: PackageSpec[] = [
  hc('74HC00', 'nand', 2, 4, '4 NAND per 7400 (datasheets, CHECKS.md)'), hc('74HC10', 'nand', 3, 3), hc('74HC20', 'nand', 4, 2), hc('74HC30', 'nand', 8, 1),
  hc('74HC02', 'nor', 2, 4, '4 NOR per 7402 (from memory)'), hc('74HC27', 'nor', 3, 3), hc('74HC4002', 'nor', 4, 2),
  hc('74HC04', 'not', undefined, 6, '6 NOT per 7404 (datasheets, CHECKS.md)'), hc('74HC125', 'buffer', undefined, 4),
  hc('74HC08', 'and', 2, 4), hc('74HC11', 'and', 3, 3), hc('74HC21', 'and', 4, 2),
  hc('74HC32', 'or', 2, 4), hc('74HC4075', 'or', 3, 3),
  hc('74HC86', 'xor', 2, 4, '4 XOR per 7486 (datasheets, CHECKS.md)'), hc('74HC7266', 'xnor', 2, 4),
  hc('74HC279', 'srlatch', undefined, 4), hc('74HC75', 'dlatch', undefined, 4), hc('74HC74', 'dff', undefined, 2),
  hc('74HC157', 'mux2', undefined, 4), hc('74HC153', 'mux4', undefined, 2),
];
