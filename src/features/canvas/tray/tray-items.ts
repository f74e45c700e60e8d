/** The entries of the parts tray, in groups, with the words a search matches. */
import { KINDS_OUTSIDE_MODULES, KIND_TITLES, type PartKind } from '../../../../shared/board';
import type { TrayChoice } from '../lib/new-part';

export interface TrayItem extends TrayChoice {
  key: string;
  title: string;
  group: 'Inputs' | 'Outputs' | 'Gates' | 'Storage' | 'Blocks' | 'Modules' | 'Annotation';
  /** gates offer an input-count choice */
  multiInput: boolean;
  keywords: string;
}

const item = (kind: PartKind, group: TrayItem['group'], keywords: string, extra: Partial<TrayItem> = {}): TrayItem => ({
  key: kind, kind, title: KIND_TITLES[kind], group, multiInput: false, keywords, ...extra,
});

export const TRAY_ITEMS: TrayItem[] = [
  item('switch', 'Inputs', 'toggle switch input changeover'),
  item('button', 'Inputs', 'push button momentary input bounce'),
  item('clock', 'Inputs', 'clock square wave input'),
  item('const', 'Inputs', 'constant low zero ground 0', { key: 'const0', title: 'Constant 0', value: 0 }),
  item('const', 'Inputs', 'constant high one supply 1', { key: 'const1', title: 'Constant 1', value: 1 }),
  item('lamp', 'Outputs', 'lamp bulb light output'),
  item('probe', 'Outputs', 'probe readout output value'),
  item('buffer', 'Gates', 'buffer driver'),
  item('not', 'Gates', 'not inverter invert'),
  ...(['and', 'or', 'nand', 'nor', 'xor', 'xnor'] as const).map((k) => item(k, 'Gates', `${k} gate`, { multiInput: true })),
  item('srlatch', 'Storage', 'sr latch set reset storage memory'),
  item('dlatch', 'Storage', 'd latch transparent storage memory'),
  item('dff', 'Storage', 'd flip-flop flipflop edge register storage memory'),
  item('mux2', 'Blocks', 'multiplexer mux 2:1 select'),
  item('mux4', 'Blocks', 'multiplexer mux 4:1 select'),
  item('note', 'Annotation', 'text note comment'),
];

/** Ports: only while a module is open (a port on the top level fails the board-file check). */
export const PORT_ITEMS: TrayItem[] = [
  item('port', 'Modules', 'port module pin input in', { key: 'port-in', title: 'Port in', dir: 'in' }),
  item('port', 'Modules', 'port module pin output out', { key: 'port-out', title: 'Port out', dir: 'out' }),
];

/** The tray of a level: the top level's parts, or inside a module its parts without inputs, plus ports. */
export function trayItemsFor(inModule: boolean): TrayItem[] {
  if (!inModule) return TRAY_ITEMS;
  const outside = new Set<string>(KINDS_OUTSIDE_MODULES);
  return [...TRAY_ITEMS.filter((it) => !outside.has(it.kind)), ...PORT_ITEMS];
}

/** Tray items whose title or keywords contain every word of `query`. */
export function searchTray(query: string, items: readonly TrayItem[] = TRAY_ITEMS): TrayItem[] {
  const words = query.toLowerCase().split(/\s+/).filter(Boolean);
  if (!words.length) return [...items];
  return items.filter((it) => {
    const hay = `${it.title} ${it.keywords}`.toLowerCase();
    return words.every((w) => hay.includes(w));
  });
}

export const TRAY_MIME = 'application/x-gatefold-part';
