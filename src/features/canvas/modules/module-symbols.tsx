/**
 * Symbols of modules on the canvas: an instance is a plain box with a title band over it, its input
 * pins named down the left and its outputs down the right, each stub coloured by its live level; a
 * port is a tag pointing the way its signal flows (docs/decisions/004-modules.md). Our own look.
 */
import { pinsOfPart, type Part } from '../../../../shared/board';
import { INK } from '../lib/colors';
import { Stub, monoFont, strokeProps, type SymbolProps } from '../symbols/common';
import { useModulesView } from './modules-context';

type InstancePart = Extract<Part, { kind: 'module' }>;
type PortPart = Extract<Part, { kind: 'port' }>;

const TOP = 40;
const STEP = 20;

export function InstanceSymbol({ part, w, h, level }: SymbolProps<InstancePart>) {
  const view = useModulesView();
  const pins = pinsOfPart(part, view.pins);
  const title = view.titles.get(part.module) || part.module;
  // React Flow marks only draggable nodes `nopan`: on a viewer's canvas its zoom took a double-click on the
  // box (zooming in and stopping the event), so the module never opened. The whole box is `nopan` here.
  return (
    <g className="nopan">
      <rect x={0} y={0} width={w} height={h} fill="transparent" />
      {pins.inputs.map((pin, i) => <Stub key={`i${pin}`} x1={0} y1={TOP + i * STEP} x2={14} y2={TOP + i * STEP} level={level(pin)} />)}
      {pins.outputs.map((pin, i) => <Stub key={`o${pin}`} x1={w - 14} y1={TOP + i * STEP} x2={w} y2={TOP + i * STEP} level={level(pin)} />)}
      <rect x={14} y={4} width={w - 28} height={h - 8} rx={3} {...strokeProps} />
      <path d={`M14 ${24} H${w - 14}`} stroke={INK.stroke} strokeWidth={1.5} />
      {/* two short rails at the band's ends mark a box that can be opened */}
      <path d={`M20 9 V19 M${w - 20} 9 V19`} stroke={INK.dim} strokeWidth={1.5} />
      <text x={w / 2} y={18} textAnchor="middle" fontFamily={monoFont} fontSize={11} fill={INK.text} data-testid="instance-title">
        {title.length > 16 ? `${title.slice(0, 15)}…` : title}
      </text>
      {pins.inputs.map((pin, i) => (
        <text key={`ti${pin}`} x={19} y={TOP + i * STEP + 4} fontFamily={monoFont} fontSize={10} fill={INK.dim}>{pin}</text>
      ))}
      {pins.outputs.map((pin, i) => (
        <text key={`to${pin}`} x={w - 19} y={TOP + i * STEP + 4} textAnchor="end" fontFamily={monoFont} fontSize={10} fill={INK.dim}>{pin}</text>
      ))}
    </g>
  );
}

export function PortSymbol({ part, w, h, level }: SymbolProps<PortPart>) {
  const into = part.dir !== 'out';
  const pin = into ? 'out' : 'in';
  const d = into ? `M2 4 H${w - 30} L${w - 18} ${h / 2} L${w - 30} ${h - 4} H2 Z` : `M18 4 H${w - 2} V${h - 4} H18 L6 ${h / 2} Z`;
  return (
    <>
      {into ? <Stub x1={w - 18} y1={h / 2} x2={w} y2={h / 2} level={level(pin)} /> : <Stub x1={0} y1={h / 2} x2={6} y2={h / 2} level={level(pin)} />}
      <path d={d} {...strokeProps} />
      <text x={into ? 8 : 24} y={h / 2 + 4} fontFamily={monoFont} fontSize={11} fill={INK.text}>{part.label ?? ''}</text>
    </>
  );
}
