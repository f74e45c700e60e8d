/**
 * Gatefold build planning — the one way into `shared/build`: the logic families' build facts (each with
 * its source), conversion to NOR-only or NAND-only, the build sheet and the level check.
 *
 * ```ts
 * const { board: norOnly, gates } = convertBoard(board, 'nor');       // same truth table, NOR gates only
 * const sheet = buildSheet(board, 'tube-drl-nor', { set: 'R1=22k' });  // the `build-sheet` JSON
 * sheet.levelCheck?.low.grid;                                          // −4.8 V with the defaults
 * ```
 */
export { sourced, FROM_MEMORY, COMMON_PRACTICE, OHMS_LAW, type Sourced } from './sourced';
export { BUILD_FAMILIES, familyFacts, type BuildFamily, type BuildStyle, type FamilyFacts, type LevelNetwork, type PartLine, type Rail } from './families';
export { TTL_74LS_PACKAGES, CMOS_4000B_PACKAGES, CMOS_74HC_PACKAGES, CMOS_4000B_SUPPLY, type PackageSpec } from './packages';
export { BuildError, parseOhms, formatOhms, parseSettings, RESISTOR_KEYS, VOLT_KEYS } from './values';
export { convertBoard, type ConvertTarget, type ConvertOptions, type ConvertResult } from './convert';
export { levelCheck, indicatorCheck, VISIBLE_LED_MA, type LevelCase, type LevelCheckResult, type IndicatorCheck } from './level-check';
export { criticalPath, partLevels, type CriticalPath } from './timing';
export {
  buildSheet, requireFamily, packPackages, fanOutWarnings, unusedInputs,
  type BuildSheet, type BuildSheetOptions, type PackageCount, type PartsListLine, type RailLine, type FanOutWarning,
} from './build-sheet';
