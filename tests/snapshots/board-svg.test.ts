import { describe, expect, it } from 'vitest';
import { boardBounds, diffBoards, diffMarks, placedShape, renderBoardSvg, wireRoute } from '../../shared/render';
import type { BoardFile } from '../../shared/board';
import { contractHalfAdder } from '../helpers/boards';

/** Every tag opened is closed in order (a small well-formedness check of the markup). */
function balanced(svg: string): boolean {
  const stack: string[] = [];
  for (const m of svg.matchAll(/<(\/?)([a-zA-Z][\w:-]*)[^>]*?(\/?)>/g)) {
    const [, close, name, self] = m;
    if (self) continue;
    if (!close) stack.push(name);
    else if (stack.pop() !== name) return false;
  }
  return stack.length === 0;
}

const viewBoxOf = (svg: string) => /viewBox="([-\d.]+) ([-\d.]+) ([-\d.]+) ([-\d.]+)"/.exec(svg)!.slice(1).map(Number);

describe('renderBoardSvg', () => {
  it('frames the parts with the margin (labels included), far from the origin too', () => {
    const far: BoardFile = { ...contractHalfAdder(), parts: contractHalfAdder().parts.map((p) => ({ ...p, x: p.x + 5000, y: p.y + 3000 })) };
    const out = renderBoardSvg(far, { margin: 30 });
    // the half adder's parts span x 5040…5420 (lamp at 5360, 60 wide) and y 3040…3200, labels 16 above
    expect(boardBounds(far)).toEqual({ x: 5040, y: 3024, w: 380, h: 176 });
    expect(viewBoxOf(out.svg)).toEqual([5010, 2994, 440, 236]);
    expect([out.width, out.height]).toEqual([440, 236]);
  });

  it('scales the picture (not the board units) down to maxSize', () => {
    const out = renderBoardSvg(contractHalfAdder(), { maxSize: 220 });
    expect(Math.max(out.width, out.height)).toBe(220);
    expect(viewBoxOf(out.svg)[2]).toBe(460);
  });

  it('is vector drawing only: paths, polylines and text, no foreignObject, no HTML, no images', () => {
    const { svg } = renderBoardSvg({ ...contractHalfAdder(), parts: [...contractHalfAdder().parts, { id: 'n1', kind: 'note', x: 40, y: 240, text: 'a <b> & "c"' }] });
    expect(svg).not.toMatch(/foreignObject|<div|<image|xhtml/i);
    expect(svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(balanced(svg)).toBe(true);
    expect(svg.match(/<polyline /g)).toHaveLength(6); // one per wire
    expect(svg).toContain('>A</text>');
    expect(svg).toContain('a &lt;b&gt; &amp; &quot;c&quot;');
  });

  it('draws the dark mat by default and a light print theme on request', () => {
    expect(renderBoardSvg(contractHalfAdder()).svg).toContain('fill="#0d1014"');
    expect(renderBoardSvg(contractHalfAdder(), { theme: 'print' }).svg).toContain('fill="#ffffff"');
  });

  it('draws an empty board as a small framed picture', () => {
    const out = renderBoardSvg({ ...contractHalfAdder(), parts: [], wires: [] });
    expect(out.svg).toContain('empty board');
    expect(balanced(out.svg)).toBe(true);
  });

  it('routes wires with right angles only, starting and ending on the pins', () => {
    const board = contractHalfAdder();
    const a = board.parts.find((p) => p.id === 'a')!;
    const g1 = board.parts.find((p) => p.id === 'g1')!;
    const from = placedShape(a).pins.find((p) => p.pin === 'out')!;
    const to = placedShape(g1).pins.find((p) => p.pin === 'in0')!;
    const pts = wireRoute({ x: a.x + from.x, y: a.y + from.y, side: from.side }, { x: g1.x + to.x, y: g1.y + to.y, side: to.side });
    expect(pts[0]).toEqual({ x: 120, y: 60 });
    expect(pts[pts.length - 1]).toEqual({ x: 200, y: 80 });
    for (let i = 1; i < pts.length; i++) expect(pts[i].x === pts[i - 1].x || pts[i].y === pts[i - 1].y).toBe(true);
  });

  it('outlines compare marks in our own colours', () => {
    const before = contractHalfAdder();
    const after = { ...before, parts: before.parts.map((p) => (p.id === 'g1' ? { ...p, x: 220 } : p)) };
    const { svg } = renderBoardSvg(after, { marks: diffMarks(diffBoards(before, after)) });
    expect(svg).toContain('data-mark="changed"');
    expect(svg).toContain('#a78bfa');
  });
});
