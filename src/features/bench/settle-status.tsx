import { describeSignal, type BoardFile, type FamilyId } from '../../../shared/board';
import { familyOf } from '../../../shared/sim';
import type { LiveReport } from '../../../shared/sim';

/** Whether the board settled, and if not, which nets oscillate, fight or float. */
export function SettleStatus({ report, family, board, names }: { report: LiveReport; family: FamilyId; board: BoardFile; names: Map<string, string> }) {
  const f = familyOf(family);
  const describe = (item: string) => describeSignal(item, board, names);
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
      {report.oscillating.length > 0 && <Issue title="Does not settle" items={report.oscillating} describe={describe} />}
      {report.conflicts.length > 0 && <Issue title="Conflicts (two or more outputs, read as X)" items={report.conflicts} describe={describe} />}
      {report.undrivenInputs.length > 0 && (
        <Issue title={`Undriven inputs (${f.title}: an open input reads ${f.floating})`} items={report.undrivenInputs} describe={describe} />
      )}
      {report.races.length > 0 && <Issue title="Race in the last change (the order of simultaneous inputs decided the stored value)" items={report.races} describe={describe} />}
      {report.powerOn.length > 0 && (
        <Issue title="Power-on state chosen (a real loop settles either way; reset stored state to choose again): started low" items={report.powerOn} describe={describe} />
      )}
    </div>
  );
}

/** A titled list of report items, each by its readable name with the internal name in a tooltip. */
function Issue({ title, items, describe }: { title: string; items: string[]; describe(item: string): string }) {
  const shown = items.slice(0, 12);
  return (
    <div>
      <p className="text-slate-400">{title}:</p>
      <p className="font-mono text-slate-200">
        {shown.map((item, i) => <span key={item}>{i > 0 && ', '}<span title={item}>{describe(item)}</span></span>)}
        {items.length > shown.length && ` and ${items.length - shown.length} more`}
      </p>
    </div>
  );
}
