import type { FamilyId } from '../../../shared/board';
import { familyOf } from '../../../shared/sim';
import type { LiveReport } from '../../../shared/sim';

/** Whether the board settled, and if not, which nets oscillate, fight or float. */
export function SettleStatus({ report, family }: { report: LiveReport; family: FamilyId }) {
  const f = familyOf(family);
  const trouble = report.oscillating.length + report.conflicts.length + report.undrivenInputs.length > 0;
  return (
    <div data-testid="settle-status" className="space-y-1 text-xs">
      <p className="flex items-center gap-2">
        <span
          aria-hidden="true"
          className={report.settled ? 'h-2 w-2 rounded-full bg-emerald-400' : 'h-2 w-2 animate-pulse rounded-full bg-signal-x'}
        />
        <strong className={report.settled ? 'text-emerald-300' : 'text-signal-x'}>{report.settled ? 'Settled' : 'Oscillating'}</strong>
        {!trouble && report.settled && <span className="text-slate-500">no conflicts, every input driven</span>}
      </p>
      {report.oscillating.length > 0 && <Issue title="Does not settle" items={report.oscillating} />}
      {report.conflicts.length > 0 && <Issue title="Conflicts (two or more outputs, read as X)" items={report.conflicts} />}
      {report.undrivenInputs.length > 0 && (
        <Issue title={`Undriven inputs (an open ${f.title} input reads ${f.floating})`} items={report.undrivenInputs} />
      )}
      {report.races.length > 0 && <Issue title="Race in the last change (the order of simultaneous inputs decided the stored value)" items={report.races} />}
      {report.powerOn.length > 0 && (
        <Issue title="Power-on state chosen (a real loop settles either way; reset stored state to choose again): started low" items={report.powerOn} />
      )}
    </div>
  );
}

function Issue({ title, items }: { title: string; items: string[] }) {
  const shown = items.slice(0, 12);
  return (
    <div>
      <p className="text-slate-400">{title}:</p>
      <p className="font-mono text-slate-200">
        {shown.join(', ')}
        {items.length > shown.length && ` and ${items.length - shown.length} more`}
      </p>
    </div>
  );
}
