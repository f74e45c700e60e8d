/**
 * IEEE Std 91 distinctive-shape gates: AND (flat back, round front), OR (curved back, pointed front),
 * XOR (OR with the extra input curve), and their inverted forms with an output bubble.
 */
import type { Part } from '../../../../shared/board';
import { Bubble, Stub, strokeProps, type SymbolProps } from './common';

type GatePart = Extract<Part, { kind: 'and' | 'or' | 'nand' | 'nor' | 'xor' | 'xnor' }>;

const BACK = 20;
const FRONT = 80;

/** x of the concave OR back curve at height y (quadratic through (BACK,t), control (BACK+16, mid), (BACK,b)). */
function orBackX(y: number, t: number, b: number): number {
  const s = Math.min(1, Math.max(0, (y - t) / (b - t)));
  return BACK + 32 * s * (1 - s);
}

export function GateSymbol({ part, w, h, level }: SymbolProps<GatePart>) {
  const t = 4;
  const b = h - 4;
  const mid = h / 2;
  const inverted = part.kind === 'nand' || part.kind === 'nor' || part.kind === 'xnor';
  const orFamily = part.kind !== 'and' && part.kind !== 'nand';
  const xor = part.kind === 'xor' || part.kind === 'xnor';
  const body = orFamily
    ? `M${BACK} ${t} Q${FRONT - 16} ${t} ${FRONT + 2} ${mid} Q${FRONT - 16} ${b} ${BACK} ${b} Q${BACK + 16} ${mid} ${BACK} ${t} Z`
    : `M${BACK} ${t} H${FRONT - 30} A30 ${(b - t) / 2} 0 0 1 ${FRONT - 30} ${b} H${BACK} Z`;
  const outStart = (orFamily ? FRONT + 2 : FRONT) + (inverted ? 8 : 0);
  return (
    <>
      {Array.from({ length: part.inputs }, (_, i) => {
        const y = (i + 1) * 20;
        const end = orFamily ? orBackX(y, t, b) - (xor ? 8 : 0) : BACK;
        return <Stub key={i} x1={0} y1={y} x2={Math.max(end, 4)} y2={y} level={level(`in${i}`)} />;
      })}
      <Stub x1={outStart} y1={mid} x2={w} y2={mid} level={level('out')} />
      <path d={body} {...strokeProps} />
      {xor && <path d={`M${BACK - 8} ${t} Q${BACK + 8} ${mid} ${BACK - 8} ${b}`} {...strokeProps} fill="none" />}
      {inverted && <Bubble cx={(orFamily ? FRONT + 2 : FRONT) + 4} cy={mid} />}
    </>
  );
}

type BufferPart = Extract<Part, { kind: 'buffer' | 'not' }>;

/** Buffer: a triangle; NOT: the triangle with an output bubble. */
export function BufferSymbol({ part, w, h, level }: SymbolProps<BufferPart>) {
  const mid = h / 2;
  const tip = 72;
  const inverted = part.kind === 'not';
  return (
    <>
      <Stub x1={0} y1={mid} x2={24} y2={mid} level={level('in0')} />
      <Stub x1={tip + (inverted ? 8 : 0)} y1={mid} x2={w} y2={mid} level={level('out')} />
      <path d={`M24 ${mid - 16} L${tip} ${mid} L24 ${mid + 16} Z`} {...strokeProps} />
      {inverted && <Bubble cx={tip + 4} cy={mid} />}
    </>
  );
}
