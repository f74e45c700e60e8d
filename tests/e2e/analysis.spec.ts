import { readFileSync } from 'node:fs';
import { expect, signUp, test } from './fixtures';

// The analysis panel end to end, in a real browser against the real server and database: the example
// "Mux logic unit" (A, B data; S1 S0 select AND, OR, XOR, NOT A into a 4-to-1 multiplexer, lamp Y).
// With S1 and S0 as select inputs the function map names the function of A, B for each select code;
// deleting the XOR gate on the canvas changes the map live.
// The expected names are the example's own design (its note on the board: 00 AND, 01 OR, 10 XOR, 11 NOT A)
// and the 4-to-1 multiplexer's rule Y = D[S1 S0] (common practice, no source).
const OWNER = { name: 'Ines Okafor', email: 'ines.analysis@larkspur.example', password: 'gatefold-demo-long' };

test('the function map names each select code\'s function of A, B and follows an edit live', async ({ page, gatefold }) => {
  await page.setViewportSize({ width: 1500, height: 950 });
  await signUp(page, OWNER);
  const file = readFileSync(new URL('../../examples/mux-logic-unit.gatefold.json', import.meta.url));
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: gatefold.baseURL },
    multipart: { file: { name: 'mux-logic-unit.gatefold.json', mimeType: 'application/json', buffer: file } },
  });
  expect(imported.status()).toBe(201);
  const { board } = (await imported.json()) as { board: { id: number } };
  await page.goto(`/boards/${board.id}`);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  // a tube family: the usual caution, deferring to local electrical codes
  await expect(page.getByTestId('safety-caution')).toContainText('local electrical codes');

  const panel = page.getByTestId('analysis-panel');
  await panel.scrollIntoViewIfNeeded();
  // four switches: 16 rows (plus the header row), and Y's minimal forms
  await expect(panel.getByTestId('analysis-status')).toContainText('16 rows', { timeout: 15_000 });
  await expect(panel.getByTestId('truth-table')).toHaveAttribute('aria-rowcount', '17');
  // the worker ran the WebAssembly kernel (the page's CSP allows 'wasm-unsafe-eval', decision 007) and its
  // table is the multiplexer's: row r reads A B S0 S1, Y = D[S1 S0] with D = A AND B, A OR B, A XOR B, NOT A
  await expect(panel.getByTestId('analysis-status')).toHaveAttribute('data-kernel', 'wasm');
  const expected = Array.from({ length: 16 }, (_, r) => {
    const [a, b, s0, s1] = [(r >> 3) & 1, (r >> 2) & 1, (r >> 1) & 1, r & 1];
    return String([a & b, a | b, a ^ b, 1 - a][s1 * 2 + s0]);
  });
  const shown = await Promise.all(expected.map((_, r) => panel.getByTestId(`tt-Y-${r}`).textContent()));
  expect(shown).toEqual(expected);
  await expect(panel.getByTestId('sop-Y')).toContainText(/S0|S1/);
  await expect(panel.getByTestId('pos-Y')).not.toBeEmpty();

  // S1 first, then S0: the select code reads S1 S0
  const select = panel.getByTestId('pick-select');
  await select.getByLabel('S1').check();
  await select.getByLabel('S0').check();
  const map = panel.getByTestId('function-map');
  await expect(map).toBeVisible();
  await expect(map).toContainText('data A, B');
  const cell = (code: string) => map.getByTestId(`fmap-${code}-Y`);
  // the function id the cell names (exact, so OR does not match XOR or NOR)
  const fname = (code: string) => cell(code).locator('[data-function]');
  await expect(fname('00')).toHaveAttribute('data-function', 'AND');
  await expect(cell('00')).toContainText('AND (conjunction)');
  await expect(fname('01')).toHaveAttribute('data-function', 'OR');
  await expect(fname('10')).toHaveAttribute('data-function', 'XOR');
  await expect(fname('11')).toHaveAttribute('data-function', 'NOT_A');
  await map.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-results/analysis-01-function-map.png' });
  await panel.screenshot({ path: 'test-results/analysis-02-panel.png' });

  // Delete the XOR gate on the canvas: select code 10 no longer computes XOR, the others stay.
  await page.getByTestId('part-g_xor').click();
  await page.keyboard.press('Delete');
  await expect(page.getByTestId('part-g_xor')).toHaveCount(0);
  // the multiplexer's data input 10 is now undriven; a tube diode-resistor NOR input floats low (the
  // family's floating value, common practice, no source), so Y is 0 there for every A, B
  await expect(fname('10')).toHaveAttribute('data-function', 'FALSE', { timeout: 10_000 });
  await expect(fname('00')).toHaveAttribute('data-function', 'AND');
  await expect(fname('01')).toHaveAttribute('data-function', 'OR');
  await expect(fname('11')).toHaveAttribute('data-function', 'NOT_A');
  await map.scrollIntoViewIfNeeded();
  await panel.screenshot({ path: 'test-results/analysis-03-after-delete.png' });
});
