import type { InputHTMLAttributes, Ref } from 'react';
import { cn } from '../../lib/cn';

export const controlClass =
  'w-full rounded-md border border-mat-600 bg-mat-950 px-3 text-sm text-slate-100 placeholder:text-slate-500 focus:border-amber-glow focus:outline-none focus:ring-1 focus:ring-amber-glow aria-[invalid=true]:border-rose-500 disabled:opacity-60';

export interface InputProps extends InputHTMLAttributes<HTMLInputElement> {
  ref?: Ref<HTMLInputElement>;
}

export function Input({ className, ...rest }: InputProps) {
  return <input className={cn(controlClass, 'h-9', className)} {...rest} />;
}
