/**
 * SR latch, D latch and edge-triggered D flip-flop as IEEE Std 91 rectangles: pin names inside,
 * the dynamic-input triangle on the flip-flop's clock, and the complement output marked with a bar.
 */
import type { Part } from '../../../../shared/board';
import { pinsOf } from '../../../../shared/board';
import { INK } from '../lib/colors';
import { Stub, monoFont, strokeProps, type SymbolProps } from './common';

type StoragePart = Extract<Part, { kind: 'srlatch' | 'dlatch' | 'dff' }>;

const TITLES: Record<StoragePart['kind'], string> = { srlatch: 'SR', dlatch: 'D LATCH', dff: 'D FF' };

export function StorageSymbol({ part, w, h, level }: SymbolProps<StoragePart>) {
  const pins = pinsOf(part.kind);
  const left = 20;
  const right = w - 20;
  return (
    <>
      {pins.inputs.map((pin, i) => <Stub key={pin} x1={0} y1={20 + 40 * i} x2={left} y2={20 + 40 * i} level={level(pin)} />)}
      {pins.outputs.map((pin, i) => <Stub key={pin} x1={right} y1={20 + 40 * i} x2={w} y2={20 + 40 * i} level={level(pin)} />)}
      <rect x={left} y={2} width={right - left} height={h - 4} {...strokeProps} />
      {pins.inputs.map((pin, i) => {
        const y = 20 + 40 * i;
        if (pin === 'clk') {
          return <path key={pin} d={`M${left} ${y - 6} L${left + 9} ${y} L${left} ${y + 6}`} fill="none" stroke={INK.stroke} strokeWidth={1.5} />;
        }
        return <text key={pin} x={left + 5} y={y + 4} fontFamily={monoFont} fontSize={11} fill={INK.text}>{pin.toUpperCase()}</text>;
      })}
      {pins.inputs.includes('clk') && <text x={left + 12} y={64} fontFamily={monoFont} fontSize={9} fill={INK.dim}>CLK</text>}
      <text x={right - 5} y={24} textAnchor="end" fontFamily={monoFont} fontSize={11} fill={INK.text}>Q</text>
      <text x={right - 5} y={64} textAnchor="end" fontFamily={monoFont} fontSize={11} fill={INK.text} textDecoration="overline">Q</text>
      <text x={w / 2} y={h / 2 + 3} textAnchor="middle" fontFamily={monoFont} fontSize={8} fill={INK.dim}>{TITLES[part.kind]}</text>
      {part.init !== undefined && <text x={w / 2} y={h - 8} textAnchor="middle" fontFamily={monoFont} fontSize={7} fill={INK.dim}>init {part.init}</text>}
    </>
  );
}

type MuxPart = Extract<Part, { kind: 'mux2' | 'mux4' }>;

/** Multiplexer as a trapezoid, wide on the data side; select lines enter the slanted bottom edge. */
export function MuxSymbol({ part, w, h, level }: SymbolProps<MuxPart>) {
  const left = 20;
  const right = w - 20;
  const slant = 20;
  const data = part.kind === 'mux2' ? ['d0', 'd1'] : ['d0', 'd1', 'd2', 'd3'];
  const dataY = (i: number) => (part.kind === 'mux2' ? 20 + 40 * i : 20 + 20 * i);
  const sels = part.kind === 'mux2' ? [{ pin: 'sel', x: 40 }] : [{ pin: 'sel0', x: 60 }, { pin: 'sel1', x: 40 }];
  // y of the bottom edge at x (a straight line from (left, h - 2) to (right, h - 2 - slant))
  const bottomAt = (x: number) => h - 2 - (slant * (x - left)) / (right - left);
  const outY = h / 2 - (part.kind === 'mux2' ? 10 : 0);
  return (
    <>
      {data.map((pin, i) => <Stub key={pin} x1={0} y1={dataY(i)} x2={left} y2={dataY(i)} level={level(pin)} />)}
      {sels.map((s) => <Stub key={s.pin} x1={s.x} y1={h} x2={s.x} y2={bottomAt(s.x)} level={level(s.pin)} />)}
      <Stub x1={right} y1={outY} x2={w} y2={outY} level={level('out')} />
      <path d={`M${left} 2 L${right} ${2 + slant} L${right} ${h - 2 - slant} L${left} ${h - 2} Z`} {...strokeProps} />
      {data.map((pin, i) => <text key={pin} x={left + 4} y={dataY(i) + 4} fontFamily={monoFont} fontSize={10} fill={INK.text}>{i}</text>)}
      <text x={(left + right) / 2 + 4} y={outY + 4} textAnchor="middle" fontFamily={monoFont} fontSize={9} fill={INK.dim}>MUX</text>
    </>
  );
}
