import type { ReactNode } from 'react';

/** What a list shows when it has nothing yet, with the next step to take. */
export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="flex flex-col items-center gap-3 rounded-lg border border-dashed border-mat-600 px-6 py-10 text-center">
      {/* two idle nets: a slate (low) line meeting an unlit junction */}
      <svg width="56" height="20" viewBox="0 0 56 20" aria-hidden="true" className="text-signal-low">
        <path d="M2 10h20M34 10h20" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
        <circle cx="28" cy="10" r="4" fill="none" stroke="currentColor" strokeWidth="2" />
      </svg>
      <h3 className="text-sm font-semibold text-slate-200">{title}</h3>
      {children && <div className="max-w-md text-sm text-slate-400">{children}</div>}
      {action}
    </div>
  );
}
