/** A figure with where it comes from, so that every build number can be traced (CHECKS.md). */
export interface Sourced<T> {
  value: T;
  /** a datasheet, a tube data table, "common practice, no source" or "from memory" */
  source: string;
}

/** A sourced value. */
export const sourced = <T>(value: T, source: string): Sourced<T> => ({ value, source });

export const FROM_MEMORY = 'from memory';
export const COMMON_PRACTICE = 'common practice, no source';
export const OHMS_LAW = "Ohm's law (common practice, no source)";
