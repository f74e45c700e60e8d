import { FUNCTION_TITLES } from '../../../shared/analysis';
import type { AnalysisResult } from './protocol';

/** The function map: per select combination, what each output computes of the data inputs. */
export function FunctionMapView({ result, select }: { result: AnalysisResult; select: string[] }) {
  if (!result.functionMap.length) return null;
  const data = result.functionMap[0].data;
  return (
    <div className="overflow-x-auto rounded border border-mat-700" data-testid="function-map">
      <table className="w-full border-collapse text-xs">
        <caption className="px-2 py-1 text-left text-slate-400">
          Function map: {select.join(', ')} select; data {data.length ? data.join(', ') : '(none)'}{data.length === 2 && (data[0] !== 'A' || data[1] !== 'B') ? ` (A = ${data[0]}, B = ${data[1]})` : ''}
        </caption>
        <thead className="bg-mat-800 text-slate-300">
          <tr>
            <th scope="col" className="px-2 py-1 text-left font-mono">{select.join('')}</th>
            {result.outputs.map((o) => <th key={o} scope="col" className="px-2 py-1 text-left font-mono text-amber-300">{o}</th>)}
          </tr>
        </thead>
        <tbody>
          {result.functionMap.map((e) => (
            <tr key={e.select} className="odd:bg-mat-900/60">
              <td className="px-2 py-0.5 font-mono">{e.select}</td>
              {result.outputs.map((o) => {
                const f = e.functions[o];
                return (
                  <td key={o} className="px-2 py-0.5" data-testid={`fmap-${e.select}-${o}`}>
                    {/* the title already starts with the function's name (AND, NOT A…): shown once, the id kept as data */}
                    {f.name ? <span title={f.sop} data-function={f.name}>{FUNCTION_TITLES[f.name]}</span> : <code className="font-mono" title="no two-input name: its minimal SOP">{f.sop}</code>}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
