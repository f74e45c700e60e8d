import { describe, expect, it } from 'vitest';
import { analyzeBoard, enumerateTable, enumerateTableAsync, fanInCone, resolveSpec, type TableProgress } from '../../shared/analysis';
import { compileBoard } from '../../shared/sim';
import { buildBoard, type GateSpec } from './build-board';

describe('truth tables with stored state', () => {
  // SR NOR latch: S,R = 00 hold; 01 → Q=0; 10 → Q=1; 11 → Q = Q' = 0 (CHECKS.md "Sequential references").
  // Rows are simulated from power-on; the latch's X sustains itself, so power-on resolution (decision 002)
  // starts it at Q = 0 and the holding row shows that power-on state, as for a built-in storage part.
  it('flags a NOR latch built from gates and shows its hold row at the power-on state', () => {
    const gates: GateSpec[] = [{ id: 'n1', kind: 'nor', ins: ['R', 'n2'] }, { id: 'n2', kind: 'nor', ins: ['S', 'n1'] }];
    const result = analyzeBoard(buildBoard('NOR latch', ['S', 'R'], gates, { Q: 'n1', Qn: 'n2' }));
    expect(result.sequential).toBe(true);
    expect(result.outputsInfo.Q.sequential).toBe(true);
    expect(result.rows).toEqual([{ in: '00', out: '01' }, { in: '01', out: '01' }, { in: '10', out: '10' }, { in: '11', out: '00' }]);
  });

  it('flags only the outputs fed by a storage part', () => {
    const board = buildBoard('D flip-flop and a gate', ['D', 'K'], [{ id: 'inv', kind: 'not', ins: ['K'] }], { Q: 'ff_q', NK: 'inv' }, {
      parts: [{ id: 'ff', kind: 'dff', x: 300, y: 40 }, { id: 'ff_q', kind: 'buffer', x: 400, y: 40 }],
      wires: [{ id: 'wd', from: 'sw_D.out', to: 'ff.d' }, { id: 'wk', from: 'sw_K.out', to: 'ff.clk' }, { id: 'wq', from: 'ff.q', to: 'ff_q.in0' }],
    });
    const result = analyzeBoard(board);
    expect(result.outputsInfo.Q.sequential).toBe(true);
    expect(result.outputsInfo.NK.sequential).toBe(false);
    // power-on Q = 0 and setting the inputs is no clock edge (common practice, no source)
    expect(result.rows.map((r) => r.out)).toEqual(['01', '00', '01', '00']);
  });
});

describe('inputs not enumerated', () => {
  // CONTRACTS §2: inputs not chosen are held at their board values; with B on, S = A XOR 1 = ~A.
  it('holds them at their board values', () => {
    const board = buildBoard('Half adder', ['A', 'B'], [{ id: 'x', kind: 'xor', ins: ['A', 'B'] }], { S: 'x' });
    const on = { ...board, parts: board.parts.map((p) => (p.id === 'sw_B' && p.kind === 'switch' ? { ...p, on: true } : p)) };
    const result = analyzeBoard(on, { inputs: ['A'] });
    expect(result.rows).toEqual([{ in: '0', out: '1' }, { in: '1', out: '0' }]);
    expect(result.outputsInfo.S.sop).toBe('~A');
  });
});

describe('four values', () => {
  // An undriven net is Z; an ideal-family reader of it sees X (CONTRACTS §1; common practice, no source).
  it('reads Z on an unconnected lamp and X after a floating gate input', () => {
    const board = buildBoard('Loose ends', ['A'], [{ id: 'g', kind: 'and', ins: ['A'] }], { Y: 'g' }, {
      parts: [{ id: 'loose', kind: 'lamp', label: 'L', x: 0, y: 300 }],
    });
    // g.in1 has no wire: with A = 0 the AND is 0 regardless, with A = 1 it is X
    const result = analyzeBoard({ ...board, parts: board.parts.map((p) => (p.id === 'g' ? { ...p, inputs: 2 } : p)) });
    expect(result.rows).toEqual([{ in: '0', out: '0Z' }, { in: '1', out: 'XZ' }]);
    expect(result.outputsInfo.Y.sop).toBe('0');
  });

  // An open TTL input reads high (CHECKS.md "Logic families": from memory); shared/sim/families.ts decides it.
  it('reads an open input by the board\'s logic family', () => {
    const board = buildBoard('Open TTL input', ['A'], [{ id: 'g', kind: 'and', ins: ['A'] }], { Y: 'g' });
    const ttl = { ...board, family: 'ttl-74ls' as const, parts: board.parts.map((p) => (p.id === 'g' ? { ...p, inputs: 2 } : p)) };
    const result = analyzeBoard(ttl);
    expect(result.rows).toEqual([{ in: '0', out: '0' }, { in: '1', out: '1' }]);
    expect(result.outputsInfo.Y.sop).toBe('A');
  });
});

describe('large tables', () => {
  const parity = (n: number) => {
    const names = Array.from({ length: n }, (_, i) => `I${i}`);
    const gates: GateSpec[] = [];
    let prev = names[0];
    for (let i = 1; i < n; i++) { gates.push({ id: `x${i}`, kind: 'xor', ins: [prev, names[i]] }); prev = `x${i}`; }
    return buildBoard(`parity ${n}`, names, gates, { P: prev });
  };

  // Parity of the row's bits (common practice, no source).
  it('enumerates 20 inputs (a million rows) by the bit-parallel path', () => {
    const netlist = compileBoard(parity(20));
    const table = enumerateTable(netlist, resolveSpec(netlist));
    expect(table.rowCount).toBe(1 << 20);
    expect(table.method).toEqual(['bit-parallel']);
    for (const r of [0, 1, 2, 3, 12345, 699050, (1 << 20) - 1]) {
      let bits = 0;
      for (let v = r; v; v >>= 1) bits += v & 1;
      expect(table.values[0][r]).toBe(bits & 1);
    }
  });

  it('refuses more than 20 inputs with a clear message', () => {
    const netlist = compileBoard(parity(21));
    expect(() => resolveSpec(netlist)).toThrow(/limited to 20 inputs/);
  });

  it('reports progress and can be cancelled', async () => {
    const netlist = compileBoard(parity(16));
    const spec = resolveSpec(netlist);
    const seen: TableProgress[] = [];
    const table = await enumerateTableAsync(netlist, spec, { chunkRows: 4096, onProgress: (p) => seen.push(p) });
    expect(seen.length).toBe(16);
    expect(seen.at(-1)).toEqual({ done: 65536, total: 65536 });
    expect(table.values[0][65535]).toBe(0);
    const ctl = new AbortController();
    const run = enumerateTableAsync(netlist, spec, { chunkRows: 1024, onProgress: (p) => { if (p.done >= 4096) ctl.abort(); }, signal: ctl.signal });
    await expect(run).rejects.toThrow(/cancelled/);
  });

  it('finds the fan-in cone of an output', () => {
    const board = buildBoard('two cones', ['A', 'B', 'C'], [{ id: 'g1', kind: 'and', ins: ['A', 'B'] }, { id: 'g2', kind: 'not', ins: ['C'] }], { Y: 'g1', Z: 'g2' });
    expect([...fanInCone(compileBoard(board), ['lamp_Y'])].sort()).toEqual(['g1', 'lamp_Y', 'sw_A', 'sw_B']);
  });
});
