/**
 * The bring-up panel: the vectors with their expected lamps, what each lamp really showed (editors
 * record it; the record is shared through the server), the suspects that explain it (click one to see
 * it on the canvas), the next vector to try, the printable sheet and the build photos.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Button } from '../../components/ui/button';
import { Spinner } from '../../components/ui/spinner';
import { errorMessage } from '../../lib/api-client';
import { canEdit, isOwner } from '../../lib/roles';
import { useSeen } from '../../lib/use-seen';
import { bringupKeys, clearObservations, recordObservation, removeObservation } from './api';
import { BringupSheet } from './bringup-sheet';
import { PhotosStrip } from './photos-strip';
import type { Bringup } from './use-bringup';

const WORKING = { vectors: 'Working out the test vectors…', diagnosis: 'Ranking the suspects…' } as const;

const lampText = (b: string) => (b === '1' ? '●' : b === '0' ? '○' : '?');

export function BringupPanel({ bringup, me }: { bringup: Bringup; me: number | null }) {
  const { vectors: result, diagnosis, role, boardId } = bringup;
  const qc = useQueryClient();
  const [seen, setSeen] = useState<Record<number, string>>({});
  const [error, setError] = useState<string | null>(null);
  const refresh = () => qc.invalidateQueries({ queryKey: bringupKeys.observations(boardId) });
  const save = useMutation({
    mutationFn: (o: { in: string; out: string; step: number | null }) => recordObservation(boardId, o),
    onSuccess: () => { setError(null); void refresh(); },
    onError: (err) => setError(errorMessage(err)),
  });
  const remove = useMutation({ mutationFn: (id: number) => removeObservation(boardId, id), onSuccess: () => void refresh() });
  const clear = useMutation({ mutationFn: () => clearObservations(boardId), onSuccess: () => { setSeen({}); void refresh(); } });
  const print = () => window.print();
  const editable = canEdit(role);
  // the vectors are worked out (in a worker) once the panel is on screen
  const ref = useSeen<HTMLElement>(bringup.want);
  return (
    <section ref={ref} aria-label="Bring-up" aria-busy={bringup.working !== null} data-testid="bringup-panel" className="space-y-3 border-t border-mat-700 p-3 text-sm">
      <header className="flex items-center gap-2">
        <h2 className="font-semibold text-amber-300">Bring-up</h2>
        {result && !bringup.stale && <Button size="sm" className="ml-auto" onClick={print} data-testid="bringup-print">Print sheet</Button>}
      </header>
      {bringup.working && (
        <p className="flex items-center gap-2 text-xs text-slate-400" data-testid="bringup-working">
          <Spinner size="sm" label={WORKING[bringup.working]} className="text-amber-glow" />
          {WORKING[bringup.working]}{bringup.working === 'vectors' && result ? ' (the list below is of the board before the last change)' : ''}
          <Elapsed key={bringup.working} />
        </p>
      )}
      {bringup.error && !bringup.working && <p role="alert" className="rounded border border-rose-800 bg-rose-950/50 p-2 text-xs text-rose-200">{bringup.error}</p>}
      {result && (
        <>
          <BringupSheet board={bringup.board} result={result} />
          <p className="text-xs text-slate-400" data-testid="bringup-summary">
            {result.vectors.length} vectors detect {result.detected} of {result.faults} stuck-at faults
            {result.undetectable.length ? `; ${result.undetectable.length} undetectable` : ''}. {result.minimal ? 'Proved the fewest.' : 'Not proved the fewest.'}
          </p>
          {result.reasons.length > 0 && (
            <details className="text-xs text-slate-400">
              <summary>Undetectable faults</summary>
              <ul className="mt-1 space-y-0.5">{result.reasons.map((r) => <li key={r.fault}><span className="font-mono text-slate-300">{r.fault}</span> — {r.reason}</li>)}</ul>
            </details>
          )}
          <table className={bringup.stale ? 'w-full font-mono text-xs opacity-60' : 'w-full font-mono text-xs'} data-testid="bringup-vectors">
            <thead className="text-slate-500">
              <tr><th className="text-left">#</th><th className="text-left">{result.inputs.join(' ')}</th><th>expect</th><th>saw</th><th /></tr>
            </thead>
            <tbody>
              {result.vectors.map((v, k) => {
                const now = seen[k] ?? v.out;
                return (
                  <tr key={k} data-testid={`bringup-row-${k}`} className="border-t border-mat-800">
                    <td className="text-slate-500">{k + 1}</td>
                    <td className="text-slate-200">{v.in}</td>
                    <td className="text-center text-amber-200">{Array.from(v.out).map(lampText).join('')}</td>
                    <td className="text-center">
                      {Array.from(now).map((b, i) => (
                        <button key={i} type="button" disabled={!editable} data-testid={`bringup-lamp-${k}-${result.outputs[i]}`}
                          title={`${result.outputs[i]}: click if the lamp showed otherwise`} aria-pressed={b === '1'}
                          className={b !== v.out[i] ? 'px-0.5 text-rose-300' : 'px-0.5 text-slate-300'}
                          onClick={() => setSeen((s) => ({ ...s, [k]: now.slice(0, i) + (b === '1' ? '0' : '1') + now.slice(i + 1) }))}>
                          {lampText(b)}
                        </button>
                      ))}
                    </td>
                    <td>{editable && <Button size="sm" variant="ghost" data-testid={`bringup-record-${k}`} disabled={bringup.stale} onClick={() => save.mutate({ in: v.in, out: now, step: result.sequential ? k : null })}>Record</Button>}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {error && <p role="alert" className="text-xs text-rose-300">{error}</p>}
          <Suspects bringup={bringup} />
          {diagnosis?.next && (bringup.wrong || (diagnosis.candidates.length > 0 && diagnosis.faultFree.explains < diagnosis.faultFree.of)) && (
            <p className="text-xs text-slate-300" data-testid="bringup-next">
              Try next: <span className="font-mono text-amber-200">{result.inputs.map((l, i) => `${l}=${diagnosis.next!.in[i]}`).join(' ')}</span>
              <span className="text-slate-500"> (tells {diagnosis.next.groups} groups of suspects apart)</span>
            </p>
          )}
          {bringup.observations.data && bringup.observations.data.length > 0 && (
            <details className="text-xs text-slate-400">
              <summary>Record ({bringup.observations.data.length})</summary>
              <ul className="mt-1 space-y-0.5">
                {bringup.observations.data.map((o) => (
                  <li key={o.id} className="flex items-center gap-2">
                    <span className="font-mono text-slate-300">{o.in} → {o.out}</span>
                    <span>{o.user?.name ?? 'someone'}, {new Date(o.createdAt).toLocaleString()}</span>
                    {(o.user?.id === me || isOwner(role)) && editable && <button type="button" className="text-rose-300" onClick={() => remove.mutate(o.id)} aria-label="Remove observation">✕</button>}
                  </li>
                ))}
              </ul>
              {isOwner(role) && <Button size="sm" variant="ghost" onClick={() => clear.mutate()}>Clear the record</Button>}
            </details>
          )}
        </>
      )}
      <PhotosStrip boardId={boardId} role={role} me={me} />
    </section>
  );
}

/** Seconds since it mounted, from the third on (a sequential board's vectors can take half a minute). */
function Elapsed() {
  const [s, setS] = useState(0);
  useEffect(() => {
    const t = setInterval(() => setS((n) => n + 1), 1000);
    return () => clearInterval(t);
  }, []);
  return s >= 2 ? <span className="ml-auto font-mono text-slate-500" data-testid="bringup-elapsed">{s} s</span> : null;
}

function Suspects({ bringup }: { bringup: Bringup }) {
  const { diagnosis } = bringup;
  if (!diagnosis) return bringup.working ? null : <p className="text-xs text-slate-500">Record what the lamps showed to see the suspects.</p>;
  if (!bringup.wrong) return <p className="text-xs text-emerald-300" data-testid="bringup-all-good">Every recorded lamp matches the board.</p>;
  return (
    <div data-testid="bringup-suspects" className="space-y-1">
      <div className="flex items-center gap-2">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-slate-400">Suspects</h3>
        <label className="ml-auto flex items-center gap-1 text-[11px] text-slate-400">
          <input type="checkbox" checked={bringup.show} onChange={(e) => bringup.setShow(e.target.checked)} /> show on canvas
        </label>
      </div>
      <ol className="space-y-0.5 text-xs">
        {diagnosis.candidates.slice(0, 6).map((c) => (
          <li key={c.fault}>
            <button type="button" onClick={() => bringup.setChosen(c.fault)} aria-pressed={bringup.suspect?.fault === c.fault}
              className={bringup.suspect?.fault === c.fault ? 'w-full rounded bg-mat-700 px-1 text-left' : 'w-full rounded px-1 text-left hover:bg-mat-800'}>
              <span className="font-mono text-slate-100">{c.fault}</span> <span className="text-slate-400">explains {c.explains}/{c.of}</span>
              {c.equivalent.length > 0 && <span className="block text-[11px] text-slate-500">same as {c.equivalent.slice(0, 4).join(', ')}{c.equivalent.length > 4 ? '…' : ''}</span>}
            </button>
          </li>
        ))}
      </ol>
    </div>
  );
}
