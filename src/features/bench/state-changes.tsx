import type { StateChange } from '../../../shared/sim';

/** After an edit: the storage elements whose stored level it changed, each with the reason. */
export function StateChanges({ changes }: { changes: StateChange[] }) {
  if (!changes.length) return null;
  return (
    <div data-testid="state-changes" className="mt-2 rounded border border-amber-700/60 bg-amber-950/30 p-2 text-[11px] text-amber-100">
      <p className="font-semibold">The last edit changed stored state:</p>
      <ul className="mt-1 list-disc pl-4">
        {changes.map((c) => <li key={c.partId}>{c.reason}</li>)}
      </ul>
    </div>
  );
}
