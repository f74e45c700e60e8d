import type { Ref, SelectHTMLAttributes } from 'react';
import { cn } from '../../lib/cn';
import { controlClass } from './input';

export interface SelectProps extends SelectHTMLAttributes<HTMLSelectElement> {
  ref?: Ref<HTMLSelectElement>;
  options: ReadonlyArray<{ value: string; label: string }>;
}

export function Select({ className, options, ...rest }: SelectProps) {
  return (
    <select className={cn(controlClass, 'h-9 pr-8', className)} {...rest}>
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </select>
  );
}
