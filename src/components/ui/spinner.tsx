import { cn } from '../../lib/cn';

/** A ring that spins; `label` is read out to screen readers. */
export function Spinner({ size = 'md', label, className }: { size?: 'sm' | 'md' | 'lg'; label?: string; className?: string }) {
  const px = size === 'sm' ? 'h-3.5 w-3.5 border-2' : size === 'lg' ? 'h-8 w-8 border-[3px]' : 'h-5 w-5 border-2';
  return (
    <span role="status" aria-label={label ?? 'Loading'} className={cn('inline-block animate-spin rounded-full border-current border-t-transparent', px, className)} />
  );
}

/** A centred spinner with a line of text, for a region that is still loading. */
export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="flex items-center justify-center gap-3 py-12 text-sm text-slate-400">
      <Spinner label={label} className="text-amber-glow" />
      <span>{label}</span>
    </div>
  );
}
