import { useState } from 'react';
import { Button } from '../../components/ui/button';
import type { Notation } from './expression-text';
import { FormsView } from './forms-view';
import { FunctionMapView } from './function-map-view';
import { PortPicker } from './port-picker';
import { toCsv, toTsv } from './table-export';
import { TruthTableView } from './truth-table-view';
import type { Analysis } from './use-analysis';
import { plural } from '../../lib/plural';
import { useSeen } from '../../lib/use-seen';

function download(name: string, text: string, type: string) {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

function fileStem(title: string): string {
  return title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'board';
}

/** The analysis panel of the board page: truth table, minimal forms, function names, function map. */
export function AnalysisPanel({ analysis }: { analysis: Analysis }) {
  const { result, status, progress, error, choices } = analysis;
  // the analysis runs once the panel is on screen
  const seenRef = useSeen<HTMLElement>(analysis.want);
  const [notation, setNotation] = useState<Notation>('overbar');
  const [copied, setCopied] = useState(false);
  const copyTable = () => {
    if (!result) return;
    void navigator.clipboard?.writeText(toTsv(result, choices.dontCares)).then(() => { setCopied(true); setTimeout(() => setCopied(false), 1500); });
  };
  const hasMarks = Object.values(choices.dontCares).some((r) => r.length);
  return (
    <section ref={seenRef} aria-label="Analysis" data-testid="analysis-panel" className="space-y-3 border-t border-mat-700 p-3 text-sm">
      <header className="flex items-center gap-2">
        <h2 className="font-semibold text-amber-300">Analysis</h2>
        <span className="text-xs text-slate-500" data-testid="analysis-status" data-kernel={status === 'done' ? result?.kernel : undefined}>
          {status === 'running' ? 'computing…' : status === 'cancelled' ? 'cancelled' : status === 'done' && result ? `${plural(result.rowCount, 'row')} in ${Math.round(result.ms)} ms` : ''}
        </span>
        {status === 'cancelled' && <Button size="sm" variant="ghost" onClick={analysis.rerun}>Run again</Button>}
      </header>
      {status === 'running' && progress && progress.total > 8192 && (
        <div className="flex items-center gap-2" data-testid="analysis-progress">
          <progress max={progress.total} value={progress.done} className="h-2 flex-1 accent-amber-400" aria-label="Truth table progress" />
          <Button size="sm" onClick={analysis.cancel}>Cancel</Button>
        </div>
      )}
      {error && <p role="alert" className="rounded border border-rose-800 bg-rose-950/50 p-2 text-xs text-rose-200">{error}</p>}
      {result && (
        <>
          <PortPicker inputs={result.availableInputs} outputs={result.availableOutputs}
            chosenInputs={choices.inputs ?? result.inputs} chosenOutputs={choices.outputs ?? result.outputs} select={choices.select}
            onInputs={analysis.setInputs} onOutputs={analysis.setOutputs} onSelect={analysis.setSelect} />
          {result.outputs.length === 0 ? <p className="text-xs text-slate-500">Add a lamp or probe to see a truth table.</p> : (
            <>
              <div className="flex flex-wrap items-center gap-1.5">
                <Button size="sm" onClick={copyTable}>{copied ? 'Copied' : 'Copy table (TSV)'}</Button>
                <Button size="sm" onClick={() => download(`${fileStem(analysis.board.title)}-truth-table.csv`, toCsv(result, choices.dontCares), 'text/csv')}>Export CSV</Button>
                {hasMarks && <Button size="sm" variant="ghost" onClick={analysis.clearDontCares}>Clear don’t-cares</Button>}
              </div>
              <TruthTableView result={result} dontCares={choices.dontCares} onToggle={analysis.toggleDontCare} />
              <p className="text-[11px] text-slate-500">Click an output cell to mark that row don’t-care (–) for the minimal forms.</p>
              <div className="flex items-center gap-2 text-xs">
                <span className="text-slate-500">Notation</span>
                {(['overbar', 'logic'] as const).map((n) => (
                  <button key={n} type="button" onClick={() => setNotation(n)} aria-pressed={notation === n}
                    className={notation === n ? 'rounded bg-mat-700 px-1.5 text-slate-100' : 'rounded px-1.5 text-slate-400 hover:bg-mat-800'}>
                    {n === 'overbar' ? 'A̅·B' : '¬A ∧ B'}
                  </button>
                ))}
              </div>
              <FormsView result={result} notation={notation} focus={analysis.focus} onFocus={analysis.setFocus} />
              <FunctionMapView result={result} select={choices.select.filter((s) => result.inputs.includes(s))} />
            </>
          )}
        </>
      )}
    </section>
  );
}
