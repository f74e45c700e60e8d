import { cn } from '../../lib/cn';

const TONE: Record<string, string> = {
  owner: 'border-amber-600/70 text-amber-300',
  editor: 'border-slate-cool text-sky-200',
  viewer: 'border-mat-500 text-slate-300',
};

/** A board role as a small outlined tag in the mono face. */
export function RoleBadge({ role }: { role: string }) {
  return (
    <span data-testid="role-badge" className={cn('inline-flex items-center rounded border px-1.5 py-0.5 font-mono text-[11px] lowercase', TONE[role] ?? TONE.viewer)}>
      {role}
    </span>
  );
}
