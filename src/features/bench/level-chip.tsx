import type { Level } from '../../../shared/sim';
import { cn } from '../../lib/cn';

const LOOK: Record<Level, string> = {
  '1': 'bg-signal-high/20 text-signal-high border-signal-high/60 shadow-[0_0_6px_rgba(255,179,71,0.45)]',
  '0': 'bg-signal-low/15 text-signal-low border-signal-low/60',
  X: 'bg-signal-x/20 text-signal-x border-signal-x/60',
  Z: 'text-signal-z border-signal-z/70 border-dashed',
};

/** A signal value in our colours; the letter is always there so colour is never the only cue. */
export function LevelChip({ level, className }: { level: Level; className?: string }) {
  return (
    <span
      data-level={level}
      title={level === 'X' ? 'unknown' : level === 'Z' ? 'undriven' : level === '1' ? 'high' : 'low'}
      className={cn('inline-flex h-5 min-w-6 items-center justify-center rounded border px-1 font-mono text-xs', LOOK[level], className)}
    >
      {level}
    </span>
  );
}
