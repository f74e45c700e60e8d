import { MAX_RATE, MIN_RATE } from '../../../shared/sim';
import type { LiveSim } from './use-live-sim';

const btn = 'h-7 rounded border border-mat-600 bg-mat-800 px-2.5 text-xs hover:border-mat-500 hover:bg-mat-700';

/** Slider position 0…100 ↔ rate on a log scale, so both a slow hand-followable and a fast clock fit. */
export function rateFromSlider(pos: number): number {
  const lo = Math.log10(MIN_RATE);
  const hi = Math.log10(MAX_RATE);
  const hz = 10 ** (lo + ((hi - lo) * pos) / 100);
  return hz < 10 ? Math.round(hz * 10) / 10 : Math.round(hz);
}
export function sliderFromRate(hz: number): number {
  const lo = Math.log10(MIN_RATE);
  const hi = Math.log10(MAX_RATE);
  return Math.round(((Math.log10(hz) - lo) / (hi - lo)) * 100);
}

/** Run / pause / single step of the board's clock inputs, and the simulated clock rate. */
export function ClockControls({ clock }: { clock: LiveSim['clock'] }) {
  return (
    <div className="space-y-1.5">
      <div className="flex items-center gap-2">
        {clock.running ? (
          <button type="button" className={btn} onClick={clock.pause}>Pause</button>
        ) : (
          <button type="button" className={btn} onClick={clock.run}>Run</button>
        )}
        <button type="button" className={btn} onClick={clock.step} disabled={clock.running} title="One full cycle: high, settle, low, settle">
          Step
        </button>
        <span className="ml-auto font-mono text-xs text-slate-400" data-testid="bench-cycles">cycle {clock.cycles}</span>
      </div>
      <label className="flex items-center gap-2 text-xs text-slate-400">
        Rate
        <input
          type="range"
          min={0}
          max={100}
          value={sliderFromRate(clock.rate)}
          onChange={(e) => clock.setRate(rateFromSlider(Number(e.target.value)))}
          className="flex-1 accent-amber-400"
          aria-label="Clock rate"
        />
        <span className="w-16 text-right font-mono text-slate-300">{clock.rate} Hz</span>
      </label>
    </div>
  );
}
