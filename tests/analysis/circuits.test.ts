import { describe, expect, it } from 'vitest';
import { analyzeBoard, columnOfFunction, FUNCTION_IDS, FUNCTION_TITLES, functionIdOfColumn } from '../../shared/analysis';
import type { Part, Wire } from '../../shared/board';
import { buildBoard, twoInputCircuits, type GateSpec } from './build-board';

// Source of every name and column: Wikipedia "Truth table", section "Binary operations"
// (CHECKS.md "The 16 two-input functions", output column over AB = 00, 01, 10, 11).
const COLUMNS: Record<string, string> = {
  FALSE: '0000', AND: '0001', A_AND_NOT_B: '0010', A: '0011', NOT_A_AND_B: '0100', B: '0101', XOR: '0110', OR: '0111',
  NOR: '1000', XNOR: '1001', NOT_B: '1010', A_OR_NOT_B: '1011', NOT_A: '1100', NOT_A_OR_B: '1101', NAND: '1110', TRUE: '1111',
};
const TITLES: Record<string, RegExp> = {
  FALSE: /contradiction/, A_AND_NOT_B: /material nonimplication/, A: /projection/, NOT_A_AND_B: /converse nonimplication/,
  NOR: /Peirce arrow/, XNOR: /biconditional/, A_OR_NOT_B: /converse implication/, NOT_A_OR_B: /material implication/, NAND: /Sheffer stroke/,
};

describe('the 16 two-input functions', () => {
  it('maps columns to ids and standard names', () => {
    expect(FUNCTION_IDS).toHaveLength(16);
    for (const [id, col] of Object.entries(COLUMNS)) {
      expect(functionIdOfColumn(col)).toBe(id);
      expect(columnOfFunction(id as (typeof FUNCTION_IDS)[number])).toBe(col);
    }
    for (const [id, re] of Object.entries(TITLES)) expect(FUNCTION_TITLES[id as (typeof FUNCTION_IDS)[number]]).toMatch(re);
  });

  it('names each one built as a gate circuit and analysed', () => {
    const circuits = twoInputCircuits();
    expect(Object.keys(circuits).sort()).toEqual(Object.keys(COLUMNS).sort());
    for (const [id, c] of Object.entries(circuits)) {
      const result = analyzeBoard(buildBoard(id, ['A', 'B'], c.gates, { Y: c.out }));
      expect(result.rows.map((r) => r.out).join(''), id).toBe(COLUMNS[id]);
      expect(result.outputsInfo.Y.function, id).toBe(id);
    }
  });
});

describe('combinational references', () => {
  // Full adder: S = A⊕B⊕Cin = Σm(1,2,4,7), Cout = AB + A·Cin + B·Cin = Σm(3,5,6,7) (any digital-logic
  // textbook); also checked against integer addition A+B+Cin (common practice).
  it('tabulates a full adder as integer addition', () => {
    const gates: GateSpec[] = [
      { id: 'x1', kind: 'xor', ins: ['A', 'B'] }, { id: 'x2', kind: 'xor', ins: ['x1', 'Cin'] },
      { id: 'a1', kind: 'and', ins: ['A', 'B'] }, { id: 'a2', kind: 'and', ins: ['x1', 'Cin'] }, { id: 'o1', kind: 'or', ins: ['a1', 'a2'] },
    ];
    const result = analyzeBoard(buildBoard('Full adder', ['A', 'B', 'Cin'], gates, { Cout: 'o1', S: 'x2' }));
    expect(result.rows).toHaveLength(8);
    for (const row of result.rows) {
      const sum = [...row.in].reduce((s, ch) => s + Number(ch), 0);
      expect(parseInt(row.out, 2)).toBe(sum);
    }
    expect(result.outputsInfo.Cout.sop).toBe('A & B | A & Cin | B & Cin');
    expect(result.outputsInfo.S.sop).toBe('A & B & Cin | A & ~B & ~Cin | ~A & B & ~Cin | ~A & ~B & Cin');
  });

  // A 4:1 mux whose select lines are A,B and whose data inputs are constants D0..D3 realises the two-input
  // function with output column D0D1D2D3 (CHECKS.md, common practice); 4:1 mux Y = S1'S0'D0 + … (textbook standard).
  it('realises every column with a 4:1 multiplexer of constants', () => {
    for (const [id, col] of Object.entries(COLUMNS)) {
      const parts: Part[] = [{ id: 'mx', kind: 'mux4', x: 300, y: 100 }];
      const wires: Wire[] = [
        { id: 'ws1', from: 'sw_A.out', to: 'mx.sel1' }, { id: 'ws0', from: 'sw_B.out', to: 'mx.sel0' },
        { id: 'wy', from: 'mx.out', to: 'lamp_Y.in' },
      ];
      [...col].forEach((v, d) => {
        parts.push({ id: `k${d}`, kind: 'const', label: `D${d}`, value: v === '1' ? 1 : 0, x: 200, y: 40 * d });
        wires.push({ id: `wd${d}`, from: `k${d}.out`, to: `mx.d${d}` });
      });
      const board = buildBoard(`mux ${id}`, ['A', 'B'], [], {}, { parts: [...parts, { id: 'lamp_Y', kind: 'lamp', label: 'Y', x: 400, y: 100 }], wires });
      const result = analyzeBoard(board);
      expect(result.inputs).toEqual(['A', 'B']);
      expect(result.rows.map((r) => r.out).join('')).toBe(col);
      expect(result.outputsInfo.Y.function).toBe(id);
    }
  });

  // Function map: switches S1, S0 select a 4:1 mux whose data inputs are gate functions of switches A, B;
  // each select code must name the function wired to that data input (same sources as above).
  it('names the data function of every select code in the function map', () => {
    const ids = Object.keys(COLUMNS);
    for (let group = 0; group < 4; group++) {
      const chosen = ids.slice(group * 4, group * 4 + 4);
      const gates: GateSpec[] = [];
      const wires: Wire[] = [
        { id: 'ws1', from: 'sw_S1.out', to: 'mx.sel1' }, { id: 'ws0', from: 'sw_S0.out', to: 'mx.sel0' },
        { id: 'wy', from: 'mx.out', to: 'lamp_Y.in' },
      ];
      chosen.forEach((id, d) => {
        const c = twoInputCircuits(`d${d}_`)[id];
        gates.push(...c.gates);
        wires.push({ id: `wd${d}`, from: `${c.out}.out`, to: `mx.d${d}` });
      });
      const board = buildBoard('Logic unit', ['S1', 'S0', 'A', 'B'], gates, {}, {
        parts: [{ id: 'mx', kind: 'mux4', x: 700, y: 100 }, { id: 'lamp_Y', kind: 'lamp', label: 'Y', x: 900, y: 100 }], wires,
      });
      const result = analyzeBoard(board, { select: ['S1', 'S0'] });
      expect(result.functionMap.map((e) => e.select)).toEqual(['00', '01', '10', '11']);
      result.functionMap.forEach((e, d) => {
        expect(e.data).toEqual(['A', 'B']);
        expect(e.functions.Y.name, `select ${e.select}`).toBe(chosen[d]);
      });
      // the 4:1 mux as a whole: Y = S1'S0'D0 + S1'S0D1 + S1S0'D2 + S1S0D3 (textbook standard)
      const rows = result.rows;
      rows.forEach((r) => {
        const d = parseInt(r.in.slice(0, 2), 2);
        const ab = parseInt(r.in.slice(2), 2);
        expect(r.out).toBe(COLUMNS[chosen[d]][ab]);
      });
    }
  });
});
