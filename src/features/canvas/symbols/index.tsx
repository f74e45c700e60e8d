/** The symbol of each part kind (one drawing per kind family, see the files beside this one). */
import type { Part } from '../../../../shared/board';
import type { SymbolProps } from './common';
import { BufferSymbol, GateSymbol } from './gate-symbols';
import { ButtonSymbol, ClockSymbol, ConstSymbol, SwitchSymbol } from './input-symbols';
import { LampSymbol, ProbeSymbol } from './output-symbols';
import { MuxSymbol, StorageSymbol } from './storage-symbols';
import { InstanceSymbol, PortSymbol } from '../modules/module-symbols';

/** SVG content of a part in its unrotated box; `shown` is the switch/button state to draw. */
export function PartSymbol(props: SymbolProps & { shown: boolean }) {
  const { part } = props;
  switch (part.kind) {
    case 'switch': return <SwitchSymbol {...props} part={part} />;
    case 'button': return <ButtonSymbol {...props} part={part} />;
    case 'clock': return <ClockSymbol {...props} part={part} />;
    case 'const': return <ConstSymbol {...props} part={part} />;
    case 'lamp': return <LampSymbol {...props} part={part} />;
    case 'probe': return <ProbeSymbol {...props} part={part} />;
    case 'buffer':
    case 'not': return <BufferSymbol {...props} part={part} />;
    case 'and':
    case 'or':
    case 'nand':
    case 'nor':
    case 'xor':
    case 'xnor': return <GateSymbol {...props} part={part} />;
    case 'srlatch':
    case 'dlatch':
    case 'dff': return <StorageSymbol {...props} part={part} />;
    case 'mux2':
    case 'mux4': return <MuxSymbol {...props} part={part} />;
    case 'note': return null; // drawn as HTML text by the node
    case 'port': return <PortSymbol {...props} part={part} />;
    case 'module': return <InstanceSymbol {...props} part={part} />;
    default: {
      const never: never = part;
      throw new Error(`no symbol for ${String((never as Part).kind)}`);
    }
  }
}
