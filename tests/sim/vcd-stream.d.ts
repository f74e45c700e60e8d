/** The parts of the npm package `vcd-stream` (a VCD parser) the tests use. */
declare module 'vcd-stream' {
  import type { Writable } from 'node:stream';
  export interface VcdScope { kind: 'scope'; type: string; name: string; body: (VcdScope | VcdVar)[] }
  export interface VcdVar { kind: 'var'; type: string; size: number; link: string; name: string }
  export interface VcdParser extends Writable {
    info: { wires: VcdScope; timescale?: string; date?: string; version?: string };
    change: { any(fn: (id: string, time: number | bigint, cmd: number) => void): void };
  }
  const vcd: { createVCD(): Promise<unknown>; webVcdParser(wasm: unknown): Promise<VcdParser> };
  export default vcd;
}
