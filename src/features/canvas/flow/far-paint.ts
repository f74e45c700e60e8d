/**
 * Paints the zoomed-out board on one 2D canvas: wires, then a plain box per part, then the titles that are
 * big enough to read and the badges. Strokes are gathered into one path per colour, width and dash, so a
 * 5,000-part board is a handful of fill and stroke calls, not thousands of elements for the browser to
 * style, lay out and paint on every frame. Geometry and styles come from far-scene.ts.
 */
import type { PartNode, WireEdge } from './types';
import { BADGE_FILL, boxStyle, farWireStroke, overlaps, straightRoute, type Rect } from './far-scene';
import { pinEnd, wirePath } from './wire-path';
import type { farTitle } from './zoom-detail';

export type Title = ReturnType<typeof farTitle>;

/** A wire's path, kept while its two ends stay where they are. */
interface CachedWire { key: string; path: Path2D | null; route: number[] | null; box: Rect }
export type WireCache = Map<string, CachedWire>;

/** What one paint drew (the canvas reports it on its element: the bench and the browser tests read it). */
export interface PaintStats { parts: number; wires: number; titles: number }

function wireGeometry(e: WireEdge, from: PartNode, to: PartNode, cache: WireCache): CachedWire | null {
  const s = pinEnd(from, e.sourceHandle);
  const t = pinEnd(to, e.targetHandle);
  if (!s || !t) return null;
  const loop = e.source === e.target ? { ...from.position, width: from.width ?? 0, height: from.height ?? 0 } : null;
  const key = `${s.x},${s.y},${s.position},${t.x},${t.y},${t.position}${loop ? `,${loop.x},${loop.y},${loop.width},${loop.height}` : ''}`;
  const old = cache.get(e.id);
  if (old && old.key === key) return old;
  const route = loop ? null : straightRoute(s.x, s.y, s.position, t.x, t.y, t.position);
  const path = route ? null
    : new Path2D(wirePath({ sourceX: s.x, sourceY: s.y, sourcePosition: s.position, targetX: t.x, targetY: t.y, targetPosition: t.position }, loop));
  // right-angle routes stay within their ends plus the step offset; a self loop goes round its part
  const pad = loop ? 24 + Math.max(loop.width, loop.height) : 24;
  const box = { x: Math.min(s.x, t.x) - pad, y: Math.min(s.y, t.y) - pad, width: Math.abs(s.x - t.x) + 2 * pad, height: Math.abs(s.y - t.y) + 2 * pad };
  const made = { key, path, route, box };
  cache.set(e.id, made);
  return made;
}

interface Group { path: Path2D; n: number }
function groupOf<K>(groups: Map<K, Group>, key: K): Group {
  let g = groups.get(key);
  if (!g) { g = { path: new Path2D(), n: 0 }; groups.set(key, g); }
  return g;
}

/**
 * Paints `nodes` and `edges` that overlap `region` (flow units) on `ctx`, whose bitmap covers the region at
 * `scale` device pixels per flow unit (zoom × device pixel ratio). `zoom` turns screen-pixel widths into
 * flow units. `titleOf` gives a box's title, drawn from its least zoom.
 */
export function paintFar(ctx: CanvasRenderingContext2D, nodes: readonly PartNode[], byId: ReadonlyMap<string, PartNode>, edges: readonly WireEdge[],
  region: Rect, zoom: number, scale: number, titleOf: (n: PartNode) => Title, cache: WireCache): PaintStats {
  ctx.setTransform(1, 0, 0, 1, 0, 0);
  ctx.clearRect(0, 0, ctx.canvas.width, ctx.canvas.height);
  ctx.setTransform(scale, 0, 0, scale, -region.x * scale, -region.y * scale);
  const px = 1 / zoom; // one screen pixel in flow units

  // wires, behind the parts: one stroke per colour, width and dash
  const wires = new Map<string, Group & { color: string; width: number; dash: readonly number[] }>();
  let wireCount = 0;
  for (const e of edges) {
    const from = byId.get(e.source);
    const to = byId.get(e.target);
    if (!from || !to) continue;
    const g = wireGeometry(e, from, to, cache);
    if (!g || !overlaps(g.box, region)) continue;
    const st = farWireStroke(e.data?.level, e.data?.mark, e.selected, zoom);
    const key = `${st.color}|${st.width}|${st.dash.join(',')}`;
    let group = wires.get(key);
    if (!group) { group = { path: new Path2D(), n: 0, ...st }; wires.set(key, group); }
    if (g.route) {
      const r = g.route;
      group.path.moveTo(r[0], r[1]);
      for (let k = 2; k < r.length; k += 2) group.path.lineTo(r[k], r[k + 1]);
    } else if (g.path) group.path.addPath(g.path);
    group.n++;
    wireCount++;
  }
  ctx.lineJoin = 'round';
  ctx.lineCap = 'butt';
  for (const g of wires.values()) {
    ctx.strokeStyle = g.color;
    ctx.lineWidth = g.width * px;
    ctx.setLineDash(g.dash.map((d) => d * px));
    ctx.stroke(g.path);
  }
  ctx.setLineDash([]);

  // boxes: fills, then outlines, grouped the same way
  const fills = new Map<string, Group>();
  const strokes = new Map<string, Group>();
  const shown: PartNode[] = [];
  for (const n of nodes) {
    const w = n.width ?? n.measured?.width ?? 0;
    const h = n.height ?? n.measured?.height ?? 0;
    const { x, y } = n.position;
    if (!overlaps({ x: x - 12 * px, y: y - 12 * px, width: w + 24 * px, height: h + 24 * px }, region)) continue;
    shown.push(n);
    const st = boxStyle(n);
    const r = st.round ? Math.min(w, h) / 2 : Math.min(4, w / 4, h / 4);
    const f = groupOf(fills, `${st.fill}|${st.alpha}`);
    f.path.roundRect(x, y, w, h, r);
    f.n++;
    const s = groupOf(strokes, `${st.stroke}|${st.width}|${st.alpha}`);
    s.path.roundRect(x, y, w, h, r);
    s.n++;
  }
  for (const [key, g] of fills) {
    const [fill, alpha] = key.split('|');
    ctx.globalAlpha = Number(alpha);
    ctx.fillStyle = fill;
    ctx.fill(g.path);
  }
  for (const [key, g] of strokes) {
    const [stroke, width, alpha] = key.split('|');
    ctx.globalAlpha = Number(alpha);
    ctx.strokeStyle = stroke;
    ctx.lineWidth = Number(width) * px;
    ctx.stroke(g.path);
  }
  ctx.globalAlpha = 1;

  // titles once they are at least FAR_TITLE_MIN_PX on screen, one font setting per size
  let titles = 0;
  ctx.fillStyle = '#c9d1db';
  ctx.textAlign = 'center';
  ctx.textBaseline = 'middle';
  let font = '';
  for (const n of shown) {
    const t = titleOf(n);
    if (!t || zoom < t.minZoom) continue;
    const f = `${t.size}px "JetBrains Mono", ui-monospace, monospace`;
    if (f !== font) { ctx.font = f; font = f; }
    ctx.fillText(t.text, n.position.x + (n.width ?? 0) / 2, n.position.y + (n.height ?? 0) / 2);
    titles++;
  }

  // badges: a dot at the box's top right corner, at least 3 px across
  const badgeR = Math.max(8, 3 * px);
  for (const n of shown) {
    const badge = n.data.badge;
    if (!badge) continue;
    ctx.beginPath();
    ctx.arc(n.position.x + (n.width ?? 0), n.position.y, badgeR, 0, Math.PI * 2);
    ctx.fillStyle = BADGE_FILL[badge.tone];
    ctx.fill();
  }
  return { parts: shown.length, wires: wireCount, titles };
}
