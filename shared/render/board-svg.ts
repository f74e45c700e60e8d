/**
 * A board as a picture: real SVG shapes and text (no HTML inside), framed to the parts with a margin.
 * One pure function makes the snapshot thumbnails on the server and the board's SVG and PNG export in
 * the browser.
 */
import { splitPinRef, type BoardFile, type Part } from '../board';
import { noteShape, placedShape, rotationTransform, type Side } from './geometry';
import { symbolSvg } from './symbols';
import { FONT, MARK_COLORS, MAT_THEME, PRINT_THEME, xmlEscape, type CompareMark } from './theme';

export interface BoardSvgOptions {
  /** 'mat' (the canvas's dark surface, default) or 'print' (light) */
  theme?: 'mat' | 'print';
  /** empty space around the parts, in board units (default 40) */
  margin?: number;
  /** the picture's width and height attributes are scaled down to fit this (the viewBox keeps board units) */
  maxSize?: number;
  /** 'outline' draws plain boxes and straight wires without text: for thumbnails of large boards */
  detail?: 'full' | 'outline';
  /** compare marks: outlines in our own colours around parts and over wires */
  marks?: { parts?: ReadonlyMap<string, CompareMark>; wires?: ReadonlyMap<string, CompareMark> };
}

export interface BoardSvg {
  svg: string;
  /** the picture's size (after maxSize) */
  width: number;
  height: number;
  /** the framed region in board units */
  viewBox: { x: number; y: number; w: number; h: number };
}

const LABEL_ROOM = 16;
const STUB = 12;
const num = (v: number) => String(Math.round(v * 100) / 100);

interface Placed { part: Part; x: number; y: number; w: number; h: number; pins: Map<string, { x: number; y: number; side: Side }> }

function place(part: Part): Placed {
  const s = placedShape(part);
  return { part, x: part.x, y: part.y, w: s.w, h: s.h, pins: new Map(s.pins.map((p) => [p.pin, { x: part.x + p.x, y: part.y + p.y, side: p.side }])) };
}

/** The box around every part (labels included), or null for a board without parts. */
export function boardBounds(board: Pick<BoardFile, 'parts'>): { x: number; y: number; w: number; h: number } | null {
  if (!board.parts.length) return null;
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const part of board.parts) {
    const s = placedShape(part);
    x0 = Math.min(x0, part.x);
    y0 = Math.min(y0, part.y - (part.label ? LABEL_ROOM : 0));
    x1 = Math.max(x1, part.x + s.w);
    y1 = Math.max(y1, part.y + s.h);
  }
  return { x: x0, y: y0, w: x1 - x0, h: y1 - y0 };
}

const STEP: Record<Side, [number, number]> = { left: [-1, 0], right: [1, 0], top: [0, -1], bottom: [0, 1] };

/** An orthogonal route between two pins: out of each pin by a short stub, then across with right angles. */
export function wireRoute(a: { x: number; y: number; side: Side }, b: { x: number; y: number; side: Side }): { x: number; y: number }[] {
  const a1 = { x: a.x + STEP[a.side][0] * STUB, y: a.y + STEP[a.side][1] * STUB };
  const b1 = { x: b.x + STEP[b.side][0] * STUB, y: b.y + STEP[b.side][1] * STUB };
  const horizontal = a.side === 'left' || a.side === 'right';
  const mid = horizontal
    ? [{ x: (a1.x + b1.x) / 2, y: a1.y }, { x: (a1.x + b1.x) / 2, y: b1.y }]
    : [{ x: a1.x, y: (a1.y + b1.y) / 2 }, { x: b1.x, y: (a1.y + b1.y) / 2 }];
  return [{ x: a.x, y: a.y }, a1, ...mid, b1, { x: b.x, y: b.y }];
}

function noteSvg(part: Extract<Part, { kind: 'note' }>, w: number, h: number, theme: typeof MAT_THEME): string {
  const perLine = Math.max(1, Math.floor((w - 18) / 6.7));
  const rows: string[] = [];
  for (const l of (part.text || '').split('\n')) {
    if (!l.length) rows.push('');
    for (let i = 0; i < l.length; i += perLine) rows.push(l.slice(i, i + perLine));
  }
  const shown = rows.slice(0, Math.max(1, Math.floor((h - 10) / 15)));
  const tspans = shown.map((r, i) => `<tspan x="8" y="${18 + i * 15}">${xmlEscape(r) || ' '}</tspan>`).join('');
  return `<rect x="0.5" y="0.5" width="${w - 1}" height="${h - 1}" rx="4" fill="${theme.fill}" fill-opacity="0.6" stroke="${theme.dim}" stroke-dasharray="4 3"/>`
    + `<text font-family='${FONT}' font-size="11" fill="${theme.text}" xml:space="preserve">${tspans}</text>`;
}

/** Renders `board` as a standalone SVG document framed to its parts. */
export function renderBoardSvg(board: BoardFile, options: BoardSvgOptions = {}): BoardSvg {
  const theme = options.theme === 'print' ? PRINT_THEME : MAT_THEME;
  const margin = options.margin ?? 40;
  const outline = options.detail === 'outline';
  const bounds = boardBounds(board) ?? { x: 0, y: 0, w: 160, h: 60 };
  const vb = { x: bounds.x - margin, y: bounds.y - margin, w: bounds.w + 2 * margin, h: bounds.h + 2 * margin };
  const scale = options.maxSize ? Math.min(1, options.maxSize / Math.max(vb.w, vb.h)) : 1;
  const width = Math.max(1, Math.round(vb.w * scale));
  const height = Math.max(1, Math.round(vb.h * scale));
  const placed = new Map(board.parts.map((p) => [p.id, place(p)]));
  const out: string[] = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="${num(vb.x)} ${num(vb.y)} ${num(vb.w)} ${num(vb.h)}">`);
  out.push(`<title>${xmlEscape(board.title)}</title>`);
  out.push(`<rect x="${num(vb.x)}" y="${num(vb.y)}" width="${num(vb.w)}" height="${num(vb.h)}" fill="${theme.background}"/>`);
  if (!board.parts.length) out.push(`<text x="${num(vb.x + vb.w / 2)}" y="${num(vb.y + vb.h / 2)}" font-family='${FONT}' font-size="12" fill="${theme.dim}" text-anchor="middle">empty board</text>`);

  out.push(`<g fill="none" stroke="${theme.wire}" stroke-width="2" stroke-linejoin="round">`);
  const wireMarks: string[] = [];
  for (const wire of board.wires) {
    const a = splitPinRef(wire.from);
    const b = splitPinRef(wire.to);
    const pa = a && placed.get(a.part)?.pins.get(a.pin);
    const pb = b && placed.get(b.part)?.pins.get(b.pin);
    if (!pa || !pb) continue;
    const pts = outline ? [pa, pb] : wireRoute(pa, pb);
    const d = pts.map((p) => `${num(p.x)},${num(p.y)}`).join(' ');
    out.push(`<polyline points="${d}"/>`);
    const mark = options.marks?.wires?.get(wire.id);
    if (mark) wireMarks.push(`<polyline points="${d}" fill="none" stroke="${MARK_COLORS[mark]}" stroke-width="4" stroke-opacity="0.8"${mark === 'removed' ? ' stroke-dasharray="6 4"' : ''}/>`);
  }
  out.push('</g>', ...wireMarks);

  for (const { part, x, y, w, h } of placed.values()) {
    const s = placedShape(part);
    out.push(`<g data-part="${xmlEscape(part.id)}" transform="translate(${num(x)} ${num(y)})">`);
    if (outline) {
      out.push(`<rect width="${w}" height="${h}" rx="4" fill="${theme.fill}" stroke="${theme.stroke}" stroke-width="2"/>`);
    } else if (part.kind === 'note') {
      const n = noteShape(part.text);
      out.push(noteSvg(part, n.w, n.h, theme));
    } else {
      const turn = rotationTransform(s.baseW, s.baseH, s.rotation);
      out.push(turn ? `<g transform="${turn}">` : '<g>', symbolSvg(part, s.baseW, s.baseH, theme), '</g>');
      if (part.label) out.push(`<text x="${num(w / 2)}" y="-4" font-family='${FONT}' font-size="11" fill="${theme.text}" text-anchor="middle">${xmlEscape(part.label)}</text>`);
    }
    const mark = options.marks?.parts?.get(part.id);
    if (mark) {
      out.push(`<rect x="-7" y="-7" width="${w + 14}" height="${h + 14}" rx="6" fill="none" stroke="${MARK_COLORS[mark]}" stroke-width="2.5"${mark === 'removed' ? ' stroke-dasharray="6 4"' : ''} data-mark="${mark}"/>`);
    }
    out.push('</g>');
  }
  out.push('</svg>');
  return { svg: out.join(''), width, height, viewBox: vb };
}
