/** Output parts: a round lamp bulb that glows amber when lit, and a probe that reads out its value. */
import type { Part } from '../../../../shared/board';
import { INK, SIGNAL, levelColor } from '../lib/colors';
import { Stub, monoFont, strokeProps, type SymbolProps } from './common';

type LampPart = Extract<Part, { kind: 'lamp' }>;

export function LampSymbol({ h, level }: SymbolProps<LampPart>) {
  const v = level('in');
  const lit = v === '1';
  const cx = 38;
  const cy = h / 2;
  return (
    <>
      <Stub x1={0} y1={cy} x2={cx - 14} y2={cy} level={v} />
      {/* the glow: two soft halos (no blur filter, which is costly on large boards) */}
      {lit && <circle cx={cx} cy={cy} r={21} fill={SIGNAL.high} opacity={0.12} className="gf-glow" />}
      {lit && <circle cx={cx} cy={cy} r={17.5} fill={SIGNAL.high} opacity={0.25} className="gf-glow" />}
      <circle cx={cx} cy={cy} r={14} {...strokeProps} fill={lit ? SIGNAL.high : INK.fill} stroke={lit ? '#ffd08a' : INK.stroke}
        data-lit={lit ? 'true' : 'false'} className="gf-bulb" />
      {/* the filament */}
      <path d={`M${cx - 7} ${cy + 4} q3.5 -10 7 0 q3.5 -10 7 0`} fill="none" stroke={lit ? '#7a3e00' : INK.dim} strokeWidth={1.5} />
      {v === 'X' && <circle cx={cx} cy={cy} r={14} fill="none" stroke={SIGNAL.x} strokeWidth={2} />}
    </>
  );
}

type ProbePart = Extract<Part, { kind: 'probe' }>;

export function ProbeSymbol({ w, h, level }: SymbolProps<ProbePart>) {
  const v = level('in');
  return (
    <>
      <Stub x1={0} y1={h / 2} x2={16} y2={h / 2} level={v} />
      <path d={`M16 ${h / 2} L26 6 H${w - 4} V${h - 6} H26 Z`} {...strokeProps} />
      <text x={(w + 22) / 2} y={h / 2 + 6} textAnchor="middle" fontFamily={monoFont} fontSize={16} fill={levelColor(v)}
        data-testid="probe-value">{v ?? '–'}</text>
    </>
  );
}
