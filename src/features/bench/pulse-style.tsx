import type { Wire } from '../../../shared/board';

/** Ids of the wires that touch a pin of a net that does not settle. */
export function pulsingWireIds(wires: readonly Wire[], pulsing: ReadonlySet<string>): string[] {
  if (pulsing.size === 0) return [];
  return wires.filter((w) => pulsing.has(w.from) || pulsing.has(w.to)).map((w) => w.id);
}

/** CSS that makes the given wires of the canvas pulse (it targets the canvas library's `data-id` of each edge). */
export function pulseCss(wireIds: readonly string[]): string {
  if (!wireIds.length) return '';
  const sel = wireIds.map((id) => `.react-flow__edge[data-id="${id.replace(/["\\]/g, '\\$&')}"] .react-flow__edge-path`).join(',\n');
  return `@keyframes gf-net-pulse { 0%, 100% { opacity: 1; stroke-width: 2px; } 50% { opacity: 0.25; stroke-width: 4px; } }
${sel} { animation: gf-net-pulse 0.7s ease-in-out infinite; }
@media (prefers-reduced-motion: reduce) { ${sel} { animation-duration: 2.5s; } }`;
}

/**
 * A net that will not settle pulses on the canvas. A style element keyed by wire id keeps this out of the
 * canvas's own rendering, so the canvas needs no extra prop for it.
 */
export function PulseStyle({ wireIds }: { wireIds: readonly string[] }) {
  const css = pulseCss(wireIds);
  return css ? <style data-testid="net-pulse-style">{css}</style> : null;
}
