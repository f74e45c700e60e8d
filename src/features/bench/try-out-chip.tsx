/**
 * Reminds a viewer that their input changes and clock steps are private, with a way back to the shared
 * values (and, after clock steps, to the power-on state).
 */
export function TryOutChip({ onReset }: { onReset(): void }) {
  return (
    <p data-testid="try-out-chip" className="inline-flex items-center gap-2 rounded-full border border-amber-500/60 bg-amber-500/10 px-3 py-1 text-xs text-amber-200">
      Try-out — only you see this
      <span aria-hidden="true">·</span>
      <button type="button" onClick={onReset} className="font-semibold underline hover:text-amber-100">Reset: back to live</button>
    </p>
  );
}
