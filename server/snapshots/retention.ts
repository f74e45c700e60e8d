/**
 * Retention of automatic snapshots: every one from the last hour, then the newest of each clock hour
 * for a day, then the newest of each day for 30 days; older automatic ones go. Named, before-restore
 * and copied-from snapshots are never passed here, so they are never thinned.
 */
const HOUR = 3_600_000;
const DAY = 24 * HOUR;

export interface RetentionRule {
  keepAllMs: number;
  hourlyMs: number;
  dailyMs: number;
}

export const DEFAULT_RETENTION: RetentionRule = { keepAllMs: HOUR, hourlyMs: DAY, dailyMs: 30 * DAY };

/** The ids of automatic snapshots to delete at time `now` (ms), given all of them (any order). */
export function snapshotsToThin(items: { id: number; createdAt: string }[], now: number, rule: RetentionRule = DEFAULT_RETENTION): number[] {
  const newestFirst = [...items].sort((a, b) => Date.parse(b.createdAt) - Date.parse(a.createdAt) || b.id - a.id);
  const seen = new Set<string>();
  const drop: number[] = [];
  for (const item of newestFirst) {
    const t = Date.parse(item.createdAt);
    const age = now - t;
    if (age < rule.keepAllMs) continue;
    let bucket: string | null = null;
    if (age < rule.hourlyMs) bucket = `h${Math.floor(t / HOUR)}`;
    else if (age < rule.dailyMs) bucket = `d${Math.floor(t / DAY)}`;
    if (bucket === null || seen.has(bucket)) drop.push(item.id);
    else seen.add(bucket);
  }
  return drop;
}
