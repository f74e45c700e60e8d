import { describe, expect, it } from 'vitest';
import { createRequire } from 'node:module';
import { emptyTrace } from './trace';
import { traceToVcd } from './vcd-export';

// vcd-stream is a CommonJS package with a native parser
const vcdStream = createRequire(import.meta.url)('vcd-stream') as {
  parser(): NodeJS.WritableStream & { change: { any(fn: (id: string, time: bigint | number, cmd: number) => void): void } };
};

describe('traceToVcd', () => {
  const trace = emptyTrace(['CLK', 'Q'], 10);
  trace.signals[0].changes.push({ t: 10, v: '0' }, { t: 26, v: '1' }, { t: 42, v: '0' });
  trace.signals[1].changes.push({ t: 10, v: 'X' }, { t: 30, v: '1' }, { t: 50, v: 'Z' });
  trace.end = 60;
  const text = traceToVcd(trace, 10, '2026-12-01');

  it('writes the header, one wire per signal and the value changes (IEEE Std 1364 VCD — from memory)', () => {
    expect(text).toContain('$timescale 10 ns $end');
    expect(text).toMatch(/\$var wire 1 ! CLK \$end/);
    expect(text).toMatch(/\$var wire 1 " Q \$end/);
    expect(text).toContain('#10\n$dumpvars\n0!\nx"\n$end');
    expect(text).toContain('#26\n1!');
    expect(text).toContain('#50\nz"');
  });

  it('reads back in an independent VCD parser (npm vcd-stream) with the same changes', async () => {
    const parser = vcdStream.parser();
    const got: string[] = [];
    // change codes as vcd-stream 1.5 reports them: 14 '0', 15 '1', 16/17 x, 18/19 z
    const LEVEL: Record<number, string> = { 14: '0', 15: '1', 16: 'X', 17: 'X', 18: 'Z', 19: 'Z' };
    parser.change.any((id: string, time: bigint | number, cmd: number) => got.push(`${id}@${time}=${LEVEL[cmd] ?? `?${cmd}`}`));
    await new Promise<void>((resolve, reject) => {
      parser.on('finish', () => resolve());
      parser.on('error', reject);
      parser.end(text);
    });
    const expected = trace.signals.flatMap((s, i) => s.changes.map((c) => ({ ...c, id: i === 0 ? '!' : '"' })))
      .sort((a, b) => a.t - b.t)
      .map((c) => `${c.id}@${c.t}=${c.v}`);
    expect(got).toEqual(expected);
  });
});
