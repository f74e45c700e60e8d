/** Reads a VCD text back with the npm `vcd-stream` parser (its WebAssembly build), for the tests. */
import vcd, { type VcdScope } from 'vcd-stream';

/** Parsed signals (`scope.path/name` → id) and each id's changes as [time, level]. */
export interface ReadVcd {
  timescale?: string;
  signals: Map<string, string>;
  changes: Map<string, [number, string][]>;
}

// vcd-stream change commands for scalar values (from its bin/build.js: '0' 14, '1' 15, x 16, X 17, z 18, Z 19)
const SCALAR: Record<number, string> = { 14: '0', 15: '1', 16: 'X', 17: 'X', 18: 'Z', 19: 'Z' };

export async function readVcd(text: string): Promise<ReadVcd> {
  const parser = await vcd.webVcdParser(await vcd.createVCD());
  const changes = new Map<string, [number, string][]>();
  parser.change.any((id, time, cmd) => {
    if (!changes.has(id)) changes.set(id, []);
    changes.get(id)!.push([Number(time), SCALAR[cmd] ?? `?${cmd}`]);
  });
  await new Promise<void>((resolve, reject) => {
    parser.on('finish', () => resolve());
    parser.on('error', reject);
    parser.end(Buffer.from(text));
  });
  const signals = new Map<string, string>();
  const walk = (scope: VcdScope, path: string) => {
    for (const item of scope.body) {
      if (item.kind === 'scope') walk(item, path ? `${path}.${item.name}` : item.name);
      else signals.set(`${path}/${item.name}`, item.link);
    }
  };
  walk(parser.info.wires, '');
  return { timescale: parser.info.timescale, signals, changes };
}
