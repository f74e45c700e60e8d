import { initialsOf } from '../../lib/format';
import { cn } from '../../lib/cn';
import { personColor } from '../../lib/person-color';

/** An initials disc in the person's one colour (personColor of their user id, as in the presence bar). */
export function Avatar({ name, userId, size = 'md', className }: { name: string; userId: string | number; size?: 'sm' | 'md'; className?: string }) {
  return (
    <span
      title={name}
      aria-hidden="true"
      data-testid="avatar"
      data-color={personColor(userId)}
      style={{ background: personColor(userId) }}
      className={cn(
        'inline-flex shrink-0 select-none items-center justify-center rounded-full font-mono font-semibold text-mat-950 ring-2 ring-mat-900',
        size === 'sm' ? 'h-6 w-6 text-[10px]' : 'h-8 w-8 text-xs',
        className,
      )}
    >
      {initialsOf(name)}
    </span>
  );
}
