import type { Wire } from '../../../shared/board';

/** Ids of the wires that touch a pin of a net that does not settle. */
export function pulsingWireIds(wires: readonly Wire[], pulsing: ReadonlySet<string>): string[] {
  if (pulsing.size === 0) return [];
  return wires.filter((w) => pulsing.has(w.from) || pulsing.has(w.to)).map((w) => w.id);
}

/** Ids of the lamps and probes whose input is on a net that does not settle. */
export function oscillatingOutputIds(outputs: readonly { partId: string }[], pulsing: ReadonlySet<string>): string[] {
  return outputs.filter((p) => pulsing.has(`${p.partId}.in`)).map((p) => p.partId);
}

/** the X colour of the bench's look (tailwind `signal.x`) */
const X_COLOUR = '#e040a0';

const quote = (id: string) => id.replace(/["\\]/g, '\\$&');

/**
 * CSS that makes the given wires of the canvas pulse (it targets the canvas library's `data-id` of each
 * edge), and shows the given lamps as oscillating: the bulb pulses in the X colour instead of glowing
 * steady at whatever level the net had when the state was sent.
 */
export function pulseCss(wireIds: readonly string[], lampIds: readonly string[] = []): string {
  if (!wireIds.length && !lampIds.length) return '';
  const sel = wireIds.map((id) => `.react-flow__edge[data-id="${quote(id)}"] .react-flow__edge-path`).join(',\n');
  const bulbs = lampIds.map((id) => `.react-flow__node[data-id="${quote(id)}"] .gf-bulb`).join(',\n');
  const glows = lampIds.map((id) => `.react-flow__node[data-id="${quote(id)}"] .gf-glow`).join(',\n');
  const css = ['@keyframes gf-net-pulse { 0%, 100% { opacity: 1; stroke-width: 2px; } 50% { opacity: 0.25; stroke-width: 4px; } }'];
  if (sel) css.push(`${sel} { animation: gf-net-pulse 0.7s ease-in-out infinite; }`, `@media (prefers-reduced-motion: reduce) { ${sel} { animation-duration: 2.5s; } }`);
  if (bulbs) {
    css.push(`${bulbs} { fill: ${X_COLOUR}; stroke: ${X_COLOUR}; animation: gf-net-pulse 0.7s ease-in-out infinite; }`, `${glows} { display: none; }`,
      `@media (prefers-reduced-motion: reduce) { ${bulbs} { animation-duration: 2.5s; } }`);
  }
  return css.join('\n');
}

/**
 * A net that will not settle pulses on the canvas. A style element keyed by wire id keeps this out of the
 * canvas's own rendering, so the canvas needs no extra prop for it.
 */
export function PulseStyle({ wireIds, lampIds = [] }: { wireIds: readonly string[]; lampIds?: readonly string[] }) {
  const css = pulseCss(wireIds, lampIds);
  return css ? <style data-testid="net-pulse-style">{css}</style> : null;
}
