/** Small helpers the load benchmarks share: quantiles of sorted samples and a process's resident memory. */
import { readFileSync } from 'node:fs';

/** The q-quantile (0…1) of ascending `sorted`, interpolated between neighbours; NaN when empty. */
export function quantile(sorted: number[], q: number): number {
  if (!sorted.length) return NaN;
  const i = (sorted.length - 1) * q;
  const lo = Math.floor(i);
  const hi = Math.ceil(i);
  return sorted[lo] + (sorted[hi] - sorted[lo]) * (i - lo);
}

/** Resident memory of process `pid` in MB (Linux /proc), NaN when it cannot be read. */
export function rssMb(pid: number): number {
  const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
  return m ? Number(m[1]) / 1024 : NaN;
}
