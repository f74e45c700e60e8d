/**
 * Input parts: a changeover toggle switch drawn as a lever that swings between its two throws,
 * a momentary changeover push button whose plunger drops while held, a clock with a square-wave glyph,
 * and a constant 0 or 1.
 */
import type { PointerEvent } from 'react';
import type { Part } from '../../../../shared/board';
import { INK, SIGNAL } from '../lib/colors';
import { usePartActions } from '../flow/part-actions';
import { Stub, monoFont, strokeProps, type SymbolProps } from './common';

type SwitchPart = Extract<Part, { kind: 'switch' }>;

/** `on` drives `out` high (the lever on the upper throw), `outn` is its complement. */
export function SwitchSymbol({ part, w, level, shown }: SymbolProps<SwitchPart> & { shown: boolean }) {
  const actions = usePartActions();
  const pivot = { x: 22, y: 30 };
  // The lever points at the upper throw (y = 20) when on, the lower one (y = 40) when off.
  const angle = shown ? -14 : 14;
  return (
    <>
      <rect x={4} y={4} width={w - 20} height={52} rx={6} {...strokeProps} strokeWidth={1.5} />
      <Stub x1={60} y1={20} x2={w} y2={20} level={level('out')} />
      <Stub x1={60} y1={40} x2={w} y2={40} level={level('outn')} />
      <circle cx={60} cy={20} r={3} fill={INK.stroke} />
      <circle cx={60} cy={40} r={3} fill={INK.stroke} />
      <g className="gf-lever" style={{ transform: `rotate(${angle}deg)`, transformOrigin: `${pivot.x}px ${pivot.y}px`, transition: 'transform 120ms ease-out' }}>
        <line x1={pivot.x} y1={pivot.y} x2={58} y2={pivot.y} stroke={shown ? SIGNAL.high : INK.stroke} strokeWidth={3} strokeLinecap="round" />
      </g>
      <circle cx={pivot.x} cy={pivot.y} r={5} fill={INK.stroke} />
      <text x={10} y={54} fontFamily={monoFont} fontSize={8} fill={INK.dim}>{shown ? 'ON' : 'OFF'}</text>
      {/* The face is the actuator: a click flips the switch and also selects the part; a drag still moves
          it (the drag swallows the click, so moving never flips). */}
      <rect x={4} y={4} width={w - 20} height={52} fill="transparent" className="gf-actuator" data-testid={`actuator-${part.id}`}
        style={{ cursor: 'pointer' }} onClick={() => actions.toggleSwitch(part.id)} />
    </>
  );
}

type ButtonPart = Extract<Part, { kind: 'button' }>;

/**
 * A changeover push button: the bar rests under the normally-closed pair of contacts (`outn`, upper
 * stub) and a press moves it down to the open pair (`out`, lower stub).
 */
export function ButtonSymbol({ part, w, level, shown }: SymbolProps<ButtonPart> & { shown: boolean }) {
  const actions = usePartActions();
  const bar = shown ? 38 : 22;
  const down = (e: PointerEvent) => { e.stopPropagation(); (e.target as Element).setPointerCapture?.(e.pointerId); actions.pressButton(part.id, true); };
  const up = (e: PointerEvent) => { e.stopPropagation(); actions.pressButton(part.id, false); };
  return (
    <>
      <rect x={4} y={4} width={w - 20} height={52} rx={6} {...strokeProps} strokeWidth={1.5} />
      <Stub x1={52} y1={20} x2={w} y2={20} level={level('outn')} />
      <Stub x1={52} y1={40} x2={w} y2={40} level={level('out')} />
      {[18, 48].flatMap((x) => [18, 42].map((y) => <circle key={`${x}-${y}`} cx={x} cy={y} r={2.5} fill={INK.stroke} />))}
      <g style={{ transform: `translateY(${bar - 22}px)`, transition: 'transform 60ms linear' }}>
        <line x1={14} y1={22} x2={52} y2={22} stroke={shown ? SIGNAL.high : INK.stroke} strokeWidth={3} strokeLinecap="round" />
      </g>
      <line x1={33} y1={8} x2={33} y2={bar} stroke={INK.stroke} strokeWidth={2} />
      <line x1={27} y1={8} x2={39} y2={8} stroke={INK.stroke} strokeWidth={2} />
      {/* contact bounce is on: a small zigzag in the corner */}
      {part.bounce && <path d="M50 53 l2 -4 l2 4 l2 -4 l2 4" fill="none" stroke={INK.dim} strokeWidth={1} data-testid="bounce-mark" />}
      {/* only the plunger is the actuator (pressing must not start a drag); grab the lower edge to move the part */}
      <rect x={10} y={2} width={46} height={44} fill="transparent" className="nodrag gf-actuator" data-testid={`actuator-${part.id}`}
        style={{ cursor: 'pointer' }} onPointerDown={down} onPointerUp={up} onPointerCancel={up} />
    </>
  );
}

type ClockPart = Extract<Part, { kind: 'clock' }>;

export function ClockSymbol({ part, w, level }: SymbolProps<ClockPart>) {
  return (
    <>
      <rect x={4} y={4} width={w - 20} height={32} rx={4} {...strokeProps} />
      <path d="M12 28 H20 V12 H30 V28 H40 V12 H50 V28 H56" fill="none" stroke={level('out') === '1' ? SIGNAL.high : INK.stroke} strokeWidth={2} />
      {part.period !== undefined && <text x={8} y={34} fontFamily={monoFont} fontSize={7} fill={INK.dim}>T={part.period}</text>}
      <Stub x1={w - 16} y1={20} x2={w} y2={20} level={level('out')} />
    </>
  );
}

type ConstPart = Extract<Part, { kind: 'const' }>;

export function ConstSymbol({ part, w, level }: SymbolProps<ConstPart>) {
  return (
    <>
      <rect x={4} y={6} width={w - 24} height={28} rx={4} {...strokeProps} />
      <text x={(w - 20) / 2 + 2} y={25} textAnchor="middle" fontFamily={monoFont} fontSize={16}
        fill={part.value === 1 ? SIGNAL.high : SIGNAL.low}>{part.value}</text>
      <Stub x1={w - 20} y1={20} x2={w} y2={20} level={level('out')} />
    </>
  );
}
