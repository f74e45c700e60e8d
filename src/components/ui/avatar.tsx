import { initialsOf } from '../../lib/format';
import { cn } from '../../lib/cn';

// Our own palette for initials discs, picked by a hash of the name so each person keeps a colour.
const TONES = ['bg-amber-600 text-mat-950', 'bg-slate-cool text-mat-950', 'bg-teal-700 text-teal-50', 'bg-violet-700 text-violet-50', 'bg-lime-700 text-lime-50', 'bg-sky-800 text-sky-50'];

function toneOf(key: string): string {
  let h = 0;
  for (let i = 0; i < key.length; i++) h = (h * 31 + key.charCodeAt(i)) >>> 0;
  return TONES[h % TONES.length];
}

export function Avatar({ name, size = 'md', className }: { name: string; size?: 'sm' | 'md'; className?: string }) {
  return (
    <span
      title={name}
      aria-hidden="true"
      className={cn(
        'inline-flex shrink-0 select-none items-center justify-center rounded-full font-mono font-semibold ring-2 ring-mat-900',
        size === 'sm' ? 'h-6 w-6 text-[10px]' : 'h-8 w-8 text-xs',
        toneOf(name),
        className,
      )}
    >
      {initialsOf(name)}
    </span>
  );
}
