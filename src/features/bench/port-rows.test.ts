import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { displayNames, type BoardFile } from '../../../shared/board';
import { InputRow, OutputRow, rowName } from './port-rows';
import type { PortValue } from './use-live-sim';

// the 1-bit processor demo's top level has one unlabelled constant among labelled inputs
const board = {
  format: 'gatefold-board', version: 1, title: 'inputs', family: 'ideal',
  parts: [
    { id: 'din', kind: 'switch', label: 'DIN', x: 0, y: 0, on: false },
    { id: 'one', kind: 'const', x: 0, y: 40, value: 1 },
    { id: 'zero', kind: 'const', x: 0, y: 80, value: 0 },
    { id: 'k', kind: 'const', label: 'ENABLE_ALWAYS', x: 0, y: 120, value: 1 },
    { id: 'q', kind: 'lamp', x: 0, y: 160 },
  ],
  wires: [],
} as BoardFile;
const names = displayNames(board);
const nameOf = (id: string) => rowName(board.parts.find((p) => p.id === id), names.get(id)!);
const port = (partId: string, kind: string, value: PortValue['value']): PortValue => ({ partId, label: partId, kind, net: `${partId}_out`, value, oscillating: false });

describe('rowName', () => {
  it('shows an unlabelled constant by the level it is tied to and keeps its numbered name in full', () => {
    expect(nameOf('one')).toEqual({ shown: 'logic 1', full: 'Constant 1, tied to logic 1' });
    expect(nameOf('zero')).toEqual({ shown: 'logic 0', full: 'Constant 2, tied to logic 0' });
  });

  it('leaves labels and the other parts\u2019 names as they are', () => {
    expect(nameOf('k')).toEqual({ shown: 'ENABLE_ALWAYS', full: 'ENABLE_ALWAYS' });
    expect(nameOf('din')).toEqual({ shown: 'DIN', full: 'DIN' });
    expect(nameOf('q')).toEqual({ shown: 'Lamp 1', full: 'Lamp 1' });
  });
});

describe('InputRow and OutputRow', () => {
  it('show the short name, give the full name and id on hover and the full name to screen readers only where they differ', () => {
    const html = renderToStaticMarkup(createElement(InputRow, { port: port('one', 'const', '1'), name: nameOf('one'), onSet: () => {} }));
    expect(html).toContain('title="Constant 1, tied to logic 1 (id one)"');
    expect(html).toContain('<span aria-hidden="true">logic 1</span><span class="sr-only">Constant 1, tied to logic 1</span>');
    const lamp = renderToStaticMarkup(createElement(OutputRow, { port: port('q', 'lamp', '0'), name: nameOf('q') }));
    expect(lamp).toContain('title="Lamp 1 (id q)">Lamp 1</span>');
    expect(lamp).not.toContain('sr-only');
  });

  it('names a switch by its full name in its control', () => {
    const html = renderToStaticMarkup(createElement(InputRow, { port: port('din', 'switch', '0'), name: nameOf('din'), onSet: () => {} }));
    expect(html).toContain('aria-label="Switch DIN"');
  });
});
