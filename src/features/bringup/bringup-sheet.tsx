/**
 * The printable bring-up sheet: per vector the switch positions (changed ones marked) and what each lamp
 * should show, with boxes to tick; ordered so each step changes as few switches as possible. Rendered
 * into <body> and shown only in print (bringup.css), so the browser's print (or print to PDF) gives
 * just the sheet.
 */
import { createPortal } from 'react-dom';
import type { BoardFile } from '../../../shared/board';
import type { TestVectorsResult } from '../../../shared/bringup';
import { familyOf } from '../../../shared/sim';
import './bringup.css';

export function BringupSheet({ board, result, preview = false }: { board: BoardFile; result: TestVectorsResult; preview?: boolean }) {
  const caution = familyOf(board.family).caution;
  let prev = '0'.repeat(result.inputs.length);
  const sheet = (
    <div className={preview ? 'gf-print-sheet gf-print-preview' : 'gf-print-sheet'} data-testid="bringup-sheet">
      <h1>Bring-up sheet — {board.title || 'Untitled board'}</h1>
      <p className="gf-sheet-meta">
        {result.vectors.length} steps · detects {result.detected} of {result.faults} single stuck-at faults
        {result.undetectable.length ? ` (${result.undetectable.length} cannot be detected)` : ''} · {result.minimal ? 'fewest possible steps (proved)' : 'not proved to be the fewest steps'} · printed {new Date().toLocaleDateString()}
      </p>
      {caution && <p className="gf-sheet-caution">⚠ {caution}{/electrical codes/i.test(caution) ? '' : ' Follow your local electrical codes and qualified practice.'}</p>}
      <p className="gf-sheet-how">
        {result.sequential
          ? 'This board stores state: power it on with the first step’s switches already set, then take the steps in order. A new sequence starts again from power-on.'
          : 'Set the switches (changed ones are boxed), wait for the lamps to settle, and tick the step when every lamp matches. Note any lamp that differs.'}
      </p>
      <table>
        <thead>
          <tr>
            <th>Step</th>
            {result.inputs.map((l) => <th key={`i${l}`}>{l}</th>)}
            <th className="gf-sheet-gap" />
            {result.outputs.map((l) => <th key={`o${l}`}>{l}</th>)}
            <th>OK</th>
            <th>Lamps seen</th>
          </tr>
        </thead>
        <tbody>
          {result.vectors.map((v, k) => {
            const before = v.step === 0 ? '0'.repeat(v.in.length) : prev;
            prev = v.in;
            return (
              <tr key={k} className={v.step === 0 && k > 0 ? 'gf-sheet-restart' : undefined}>
                <td>{k + 1}{v.step === 0 ? ' ⏻' : ''}</td>
                {Array.from(v.in).map((b, i) => <td key={i} className={b !== before[i] ? 'gf-sheet-changed' : undefined}>{b === '1' ? 'ON' : 'off'}</td>)}
                <td className="gf-sheet-gap" />
                {Array.from(v.out).map((b, i) => <td key={i}>{b === '1' ? '● lit' : b === '0' ? '○ dark' : b}</td>)}
                <td><span className="gf-sheet-box" /></td>
                <td className="gf-sheet-blank" />
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
  return preview ? sheet : createPortal(sheet, document.body);
}
