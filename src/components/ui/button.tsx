import type { ButtonHTMLAttributes } from 'react';
import { cn } from '../../lib/cn';
import { Spinner } from './spinner';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-amber-glow text-mat-950 hover:bg-amber-300 font-semibold',
  secondary: 'border border-mat-600 bg-mat-800 text-slate-100 hover:border-mat-500 hover:bg-mat-700',
  ghost: 'text-slate-300 hover:bg-mat-800 hover:text-slate-100',
  danger: 'border border-rose-800 bg-rose-950/60 text-rose-200 hover:bg-rose-900/70',
};

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: 'sm' | 'md';
  /** Shows a spinner and disables the button while a request runs. */
  busy?: boolean;
}

export function Button({ variant = 'secondary', size = 'md', busy = false, className, disabled, children, type, ...rest }: ButtonProps) {
  return (
    <button
      type={type ?? 'button'}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={cn(
        'inline-flex items-center justify-center gap-2 rounded-md transition-colors focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-amber-glow disabled:cursor-not-allowed disabled:opacity-60',
        size === 'sm' ? 'h-7 px-2.5 text-xs' : 'h-9 px-4 text-sm',
        VARIANTS[variant],
        className,
      )}
      {...rest}
    >
      {busy && <Spinner size="sm" />}
      {children}
    </button>
  );
}
