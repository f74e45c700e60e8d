/**
 * The part symbols of a board picture as SVG markup, in each part's unrotated box. IEEE Std 91
 * distinctive shapes for the gates (AND: flat back, round front; OR: curved back, pointed front; XOR:
 * the extra input curve; a bubble for inversion), rectangles for storage, a trapezoid for a
 * multiplexer — our own simplified paths, the same proportions as the canvas symbols.
 */
import { pinsOf, type Part } from '../board';
import { FONT, xmlEscape, type RenderTheme } from './theme';

const num = (v: number) => String(Math.round(v * 100) / 100);

function line(x1: number, y1: number, x2: number, y2: number, color: string): string {
  return `<line x1="${num(x1)}" y1="${num(y1)}" x2="${num(x2)}" y2="${num(y2)}" stroke="${color}" stroke-width="2" stroke-linecap="round"/>`;
}

function text(x: number, y: number, s: string, size: number, color: string, anchor = 'start', extra = ''): string {
  return `<text x="${num(x)}" y="${num(y)}" font-family='${FONT}' font-size="${size}" fill="${color}" text-anchor="${anchor}"${extra}>${xmlEscape(s)}</text>`;
}

function body(d: string, t: RenderTheme, fill = t.fill): string {
  return `<path d="${d}" fill="${fill}" stroke="${t.stroke}" stroke-width="2" stroke-linejoin="round"/>`;
}

function bubble(cx: number, cy: number, t: RenderTheme): string {
  return `<circle cx="${num(cx)}" cy="${num(cy)}" r="4" fill="${t.fill}" stroke="${t.stroke}" stroke-width="1.8"/>`;
}

type GateKind = 'and' | 'or' | 'nand' | 'nor' | 'xor' | 'xnor';

function gate(kind: GateKind, inputs: number, w: number, h: number, t: RenderTheme): string {
  const back = 20;
  const front = 80;
  const top = 4;
  const bottom = h - 4;
  const mid = h / 2;
  const inverted = kind === 'nand' || kind === 'nor' || kind === 'xnor';
  const orFamily = kind !== 'and' && kind !== 'nand';
  const xor = kind === 'xor' || kind === 'xnor';
  const d = orFamily
    ? `M${back} ${top} Q${front - 16} ${top} ${front + 2} ${mid} Q${front - 16} ${bottom} ${back} ${bottom} Q${back + 16} ${mid} ${back} ${top} Z`
    : `M${back} ${top} H${front - 30} A30 ${num((bottom - top) / 2)} 0 0 1 ${front - 30} ${bottom} H${back} Z`;
  const tip = orFamily ? front + 2 : front;
  let out = '';
  for (let i = 0; i < inputs; i++) {
    const y = (i + 1) * 20;
    const s = Math.min(1, Math.max(0, (y - top) / (bottom - top)));
    const end = orFamily ? back + 32 * s * (1 - s) - (xor ? 8 : 0) : back;
    out += line(0, y, Math.max(end, 4), y, t.wire);
  }
  out += line(tip + (inverted ? 8 : 0), mid, w, mid, t.wire);
  out += body(d, t);
  if (xor) out += `<path d="M${back - 8} ${top} Q${back + 8} ${num(mid)} ${back - 8} ${bottom}" fill="none" stroke="${t.stroke}" stroke-width="2"/>`;
  if (inverted) out += bubble(tip + 4, mid, t);
  return out;
}

/** SVG markup of `part` drawn in its unrotated w×h box (notes are drawn by the caller). */
export function symbolSvg(part: Part, w: number, h: number, t: RenderTheme): string {
  switch (part.kind) {
    case 'switch': {
      const angle = part.on ? -14 : 14;
      const rad = (angle * Math.PI) / 180;
      const x2 = 22 + 36 * Math.cos(rad);
      const y2 = 30 + 36 * Math.sin(rad);
      return body(`M4 4 H${w - 16} V56 H4 Z`, t) + line(60, 20, w, 20, t.wire) + line(60, 40, w, 40, t.wire)
        + `<circle cx="60" cy="20" r="3" fill="${t.stroke}"/><circle cx="60" cy="40" r="3" fill="${t.stroke}"/>`
        + `<line x1="22" y1="30" x2="${num(x2)}" y2="${num(y2)}" stroke="${part.on ? t.on : t.stroke}" stroke-width="3" stroke-linecap="round"/>`
        + `<circle cx="22" cy="30" r="5" fill="${t.stroke}"/>` + text(10, 54, part.on ? 'ON' : 'OFF', 8, t.dim);
    }
    case 'button': {
      // a changeover contact: the bar rests under the normally-closed pair (outn) and a press moves it to the open pair (out)
      const bar = part.pressed ? 38 : 22;
      const dot = (x: number, y: number) => `<circle cx="${x}" cy="${y}" r="2.5" fill="${t.stroke}"/>`;
      return body(`M4 4 H${w - 16} V56 H4 Z`, t) + line(52, 20, w, 20, t.wire) + line(52, 40, w, 40, t.wire)
        + dot(18, 18) + dot(48, 18) + dot(18, 42) + dot(48, 42)
        + line(14, bar, 52, bar, part.pressed ? t.on : t.stroke) + line(33, 8, 33, bar, t.stroke) + line(27, 8, 39, 8, t.stroke);
    }
    case 'clock':
      return body(`M4 4 H${w - 16} V36 H4 Z`, t) + `<path d="M12 28 H20 V12 H30 V28 H40 V12 H50 V28 H56" fill="none" stroke="${t.stroke}" stroke-width="2"/>`
        + line(w - 16, 20, w, 20, t.wire);
    case 'const':
      return body(`M4 6 H${w - 20} V34 H4 Z`, t) + text((w - 20) / 2 + 2, 25, String(part.value), 16, part.value === 1 ? t.on : t.text, 'middle')
        + line(w - 20, 20, w, 20, t.wire);
    case 'lamp': {
      const cy = h / 2;
      return line(0, cy, 24, cy, t.wire) + `<circle cx="38" cy="${num(cy)}" r="14" fill="${t.fill}" stroke="${t.stroke}" stroke-width="2"/>`
        + `<path d="M31 ${num(cy + 4)} q3.5 -10 7 0 q3.5 -10 7 0" fill="none" stroke="${t.dim}" stroke-width="1.5"/>`;
    }
    case 'probe':
      return line(0, h / 2, 16, h / 2, t.wire) + body(`M16 ${h / 2} L26 6 H${w - 4} V${h - 6} H26 Z`, t) + text((w + 22) / 2, h / 2 + 5, '?', 14, t.dim, 'middle');
    case 'buffer':
    case 'not': {
      const mid = h / 2;
      const inv = part.kind === 'not';
      return line(0, mid, 24, mid, t.wire) + line(72 + (inv ? 8 : 0), mid, w, mid, t.wire) + body(`M24 ${mid - 16} L72 ${mid} L24 ${mid + 16} Z`, t)
        + (inv ? bubble(76, mid, t) : '');
    }
    case 'and': case 'or': case 'nand': case 'nor': case 'xor': case 'xnor':
      return gate(part.kind, part.inputs, w, h, t);
    case 'srlatch': case 'dlatch': case 'dff': {
      const pins = pinsOf(part.kind);
      const titles = { srlatch: 'SR', dlatch: 'D LATCH', dff: 'D FF' } as const;
      let out = '';
      pins.inputs.forEach((pin, i) => (out += line(0, 20 + 40 * i, 20, 20 + 40 * i, t.wire)));
      pins.outputs.forEach((_pin, i) => (out += line(w - 20, 20 + 40 * i, w, 20 + 40 * i, t.wire)));
      out += body(`M20 2 H${w - 20} V${h - 2} H20 Z`, t);
      pins.inputs.forEach((pin, i) => {
        const y = 20 + 40 * i;
        out += pin === 'clk'
          ? `<path d="M20 ${y - 6} L29 ${y} L20 ${y + 6}" fill="none" stroke="${t.stroke}" stroke-width="1.5"/>`
          : text(25, y + 4, pin.toUpperCase(), 11, t.text);
      });
      return out + text(w - 25, 24, 'Q', 11, t.text, 'end') + text(w - 25, 64, 'Q', 11, t.text, 'end', ' text-decoration="overline"')
        + `<line x1="${w - 33}" y1="54" x2="${w - 25}" y2="54" stroke="${t.text}" stroke-width="1"/>` + text(w / 2, h / 2 + 3, titles[part.kind], 8, t.dim, 'middle');
    }
    case 'mux2': case 'mux4': {
      const two = part.kind === 'mux2';
      const data = two ? 2 : 4;
      const dataY = (i: number) => (two ? 20 + 40 * i : 20 + 20 * i);
      const sels = two ? [40] : [60, 40];
      const bottomAt = (x: number) => h - 2 - (20 * (x - 20)) / (w - 40);
      const outY = h / 2 - (two ? 10 : 0);
      let out = '';
      for (let i = 0; i < data; i++) out += line(0, dataY(i), 20, dataY(i), t.wire);
      for (const x of sels) out += line(x, h, x, bottomAt(x), t.wire);
      out += line(w - 20, outY, w, outY, t.wire) + body(`M20 2 L${w - 20} 22 L${w - 20} ${h - 22} L20 ${h - 2} Z`, t);
      for (let i = 0; i < data; i++) out += text(24, dataY(i) + 4, String(i), 10, t.text);
      return out + text(w / 2 + 4, outY + 4, 'MUX', 9, t.dim, 'middle');
    }
    case 'note':
      return '';
    case 'port': {
      // a tag pointing the way the signal flows: into the module (in) or out of it (out)
      const into = part.dir !== 'out';
      const d = into ? `M2 4 H${w - 30} L${w - 18} ${h / 2} L${w - 30} ${h - 4} H2 Z` : `M18 4 H${w - 2} V${h - 4} H18 L6 ${h / 2} Z`;
      return (into ? line(w - 18, h / 2, w, h / 2, t.wire) : line(0, h / 2, 6, h / 2, t.wire)) + body(d, t)
        + text(into ? 8 : 24, h / 2 + 4, part.label ?? '', 11, t.text);
    }
    case 'module':
      return text(w / 2, 14, part.label || part.module, 10, t.text, 'middle') + body(`M20 20 H${w - 20} V${h - 2} H20 Z`, t);
    default: {
      const never: never = part;
      throw new Error(`no symbol for ${String((never as Part).kind)}`);
    }
  }
}
