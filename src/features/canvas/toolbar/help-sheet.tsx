/** The keyboard help sheet (opened with ?). */
import { SHORTCUTS } from './shortcuts';

export function HelpSheet({ onClose, readOnly }: { onClose(): void; readOnly: boolean }) {
  return (
    <div className="absolute inset-0 z-50 flex items-center justify-center bg-black/50" onClick={onClose} data-testid="help-sheet">
      <div role="dialog" aria-label="Keyboard shortcuts" className="w-[28rem] rounded-lg border border-mat-600 bg-mat-900 p-4 shadow-xl"
        onClick={(e) => e.stopPropagation()}>
        <div className="mb-3 flex items-center justify-between">
          <h2 className="text-sm font-semibold text-slate-100">Keyboard shortcuts</h2>
          <button type="button" className="text-xs text-slate-400 hover:text-slate-100" onClick={onClose}>Close</button>
        </div>
        <table className="w-full text-xs">
          <tbody>
            {SHORTCUTS.filter((s) => !readOnly || !s.editOnly).map((s) => (
              <tr key={s.command} className="border-t border-mat-700">
                <td className="py-1.5 pr-3 font-mono whitespace-nowrap text-amber-300">{s.keys}</td>
                <td className="py-1.5 text-slate-300">{s.does}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-3 text-[11px] text-slate-500">
          Wire by dragging from one pin to another. An input pin takes one wire; joining two outputs is allowed but warned about.
          Double-click a part to rename it; click a switch to flip it; hold a push button down. Shift-drag selects a box.
          {readOnly ? ' You are viewing: switches and buttons change only your own view (try-out).' : ''}
        </p>
      </div>
    </div>
  );
}
