/** The build sheet panel of the board page: family, counts, parts, supply, timing, level check, conversion. */
import { Link } from 'react-router-dom';
import { Select } from '../../components/ui/select';
import { FAMILY_OPTIONS } from '../../lib/families';
import type { FamilyId } from '../../../shared/board';
import { familyOf } from '../../../shared/sim';
import { useSeen } from '../../lib/use-seen';
import { SafetyCaution } from '../boards';
import { ConvertAction } from './convert-action';
import { LevelView } from './level-view';
import { SheetView } from './sheet-view';
import type { BuildSheetState } from './use-build-sheet';

/** `onWarmUp(units)` replays the heater warm-up in the bench's simulation (time units of the board's family). */
export function BuildPanel({ build, boardId, onWarmUp }: { build: BuildSheetState; boardId: number; onWarmUp?: (units: number) => void }) {
  const { sheet, error, family } = build;
  // the bench simulates the board's own family: the replay is offered when that is the family shown
  const warmUnits = sheet?.warmUpS != null && family === build.board.family ? Math.round(sheet.warmUpS * 1e9 / familyOf(family).timeUnitNs) : null;
  // the sheet is worked out once the panel is on screen
  const ref = useSeen<HTMLElement>(build.want);
  return (
    <section ref={ref} aria-label="Build sheet" data-testid="build-panel" className="space-y-2 border-t border-mat-700 p-3 text-sm">
      <header className="flex items-center gap-2">
        <h2 className="font-semibold text-amber-300">Build sheet</h2>
        <Link to={`/boards/${boardId}/build-sheet?family=${family}${build.set ? `&set=${encodeURIComponent(build.set)}` : ''}`} className="ml-auto text-xs text-amber-300 hover:underline" data-testid="build-print-link">Printable page</Link>
      </header>
      <label className="flex items-center gap-2 text-xs text-slate-400">
        Family
        <Select aria-label="Build family" data-testid="build-family" value={family} options={FAMILY_OPTIONS}
          onChange={(e) => build.setFamily(e.target.value as FamilyId)} className="h-7 flex-1 text-xs" />
      </label>
      {sheet?.caution && <div className="-mx-3"><SafetyCaution family={family} testId="build-safety-caution" /></div>}
      {error && <p role="alert" className="rounded border border-rose-800 bg-rose-950/50 p-2 text-xs text-rose-200">{error}</p>}
      {sheet && (
        <>
          <SheetView sheet={sheet} />
          {sheet.criticalPath && (
            <label className="flex items-center gap-2 text-[11px] text-slate-400">
              <input type="checkbox" checked={build.showPath} onChange={(e) => build.setShowPath(e.target.checked)} data-testid="build-show-path" />
              Show the critical path on the canvas
            </label>
          )}
          {warmUnits !== null && onWarmUp && (
            <button type="button" onClick={() => onWarmUp(warmUnits)} className="text-[11px] text-amber-300 hover:underline" data-testid="build-warm-up">
              Replay the heater warm-up in the simulation ({sheet.warmUpS} s, see the timing strip)
            </button>
          )}
        </>
      )}
      {sheet?.levelCheck && (
        <>
          <h3 className="mt-2 text-xs font-semibold text-slate-300">Level check</h3>
          <LevelView check={sheet.levelCheck} settings={build.settings} fields={build.fields} onChange={build.setSettings} />
        </>
      )}
      {error && Object.keys(build.settings).length > 0 && (
        <button type="button" className="text-[11px] text-slate-400 underline" onClick={() => build.setSettings({})}>Back to the family's values</button>
      )}
      <h3 className="mt-2 text-xs font-semibold text-slate-300">Conversion</h3>
      <ConvertAction board={build.board} />
    </section>
  );
}
