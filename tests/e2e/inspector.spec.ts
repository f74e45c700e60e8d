import type { Browser, Page } from '@playwright/test';
import { test, expect, signUp, type GatefoldServer } from './fixtures';

// The part inspector end to end: a real server, database and collaboration socket, one editor.
// Demo names from our own scenario.

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };
const VIEWER = { name: 'Tomas Reyes', email: 'tomas@room14.example', password: 'room-fourteen-77' };

const HALF_ADDER = {
  format: 'gatefold-board', version: 1, title: 'Larkspur half adder, inspector test', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'A', x: 40, y: 40, on: false },
    { id: 'b', kind: 'switch', label: 'B', x: 40, y: 160, on: false },
    { id: 'g1', kind: 'xor', inputs: 2, x: 220, y: 40 },
    { id: 'g2', kind: 'and', inputs: 2, x: 220, y: 160 },
    { id: 's', kind: 'lamp', label: 'S', x: 400, y: 40 },
    { id: 'c', kind: 'lamp', label: 'C', x: 400, y: 160 },
    { id: 'k', kind: 'clock', label: 'CLK', x: 40, y: 300 },
    { id: 'n1', kind: 'note', text: 'Half adder for the Larkspur tube-logic night', x: 220, y: 300 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'g1.in0' }, { id: 'w2', from: 'b.out', to: 'g1.in1' },
    { id: 'w3', from: 'a.out', to: 'g2.in0' }, { id: 'w4', from: 'b.out', to: 'g2.in1' },
    { id: 'w5', from: 'g1.out', to: 's.in' }, { id: 'w6', from: 'g2.out', to: 'c.in' },
  ],
};

async function importBoard(page: Page, baseURL: string): Promise<number> {
  const res = await page.request.post('/api/boards/import', {
    headers: { Origin: baseURL }, // the server takes writes only from its own origin, as a browser sends it
    multipart: { file: { name: 'half-adder.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(HALF_ADDER)) } },
  });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { board: { id: number } }).board.id;
}

async function openBoard(page: Page, boardId: number): Promise<void> {
  await page.goto(`/boards/${boardId}`);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  await expect(page.getByTestId('sync-note')).toHaveCount(0, { timeout: 15_000 });
}

test('the inspector sets a gate to 3 inputs as one undoable edit and refuses a duplicate label in place; several parts turn together', async ({ page, gatefold }) => {
  await page.setViewportSize({ width: 1400, height: 860 });
  await signUp(page, OWNER);
  const boardId = await importBoard(page, gatefold.baseURL);
  await openBoard(page, boardId);

  const inspector = page.getByTestId('part-inspector');
  await expect(inspector).toHaveCount(0); // nothing selected yet

  // One 2-input AND gate selected: its kind, id and input count.
  await page.getByTestId('part-g2').click();
  await expect(inspector.getByTestId('inspector-kind')).toHaveText('AND');
  await expect(inspector.getByTestId('inspector-id')).toHaveText('g2');
  const inputs = inspector.getByTestId('inspector-inputs');
  await expect(inputs).toHaveValue('2');
  await expect(page.getByTestId('pin-g2-in2')).toHaveCount(0);

  await inputs.selectOption('3');
  await expect(page.getByTestId('pin-g2-in2')).toHaveCount(1);
  await expect(page.getByTestId('pin-g2-in1')).toHaveCount(1);
  await page.screenshot({ path: 'test-results/inspector-01-and-three-inputs.png' });

  // Undo (Ctrl+Z on the canvas, not in a form field) takes back exactly that edit.
  await page.getByTestId('part-g2').click();
  await page.keyboard.press('Control+z');
  await expect(page.getByTestId('pin-g2-in2')).toHaveCount(0);
  await expect(inputs).toHaveValue('2');
  // the wires on the two kept pins are untouched
  await expect(page.locator('.react-flow__edge[data-id="w4"]')).toHaveCount(1);

  // A lamp: a label already on the board is refused beside the field, and nothing changes.
  await page.getByTestId('part-s').click();
  await expect(inspector.getByTestId('inspector-kind')).toHaveText('Lamp');
  const label = inspector.getByTestId('inspector-label');
  await expect(label).toHaveValue('S');
  await label.fill('C');
  await label.press('Enter');
  await expect(inspector.getByRole('alert')).toContainText('already on c');
  await expect(page.getByTestId('part-s')).toContainText('S');
  await page.screenshot({ path: 'test-results/inspector-02-label-refused.png' });
  await label.fill('SUM');
  await label.press('Enter');
  await expect(inspector.getByRole('alert')).toHaveCount(0);
  await expect(page.getByTestId('part-s')).toContainText('SUM');

  // Two parts selected: a count and the actions that apply to both.
  await page.getByTestId('part-c').click({ modifiers: ['Control'] });
  await expect(inspector.getByTestId('inspector-count')).toHaveText('2 parts selected');
  await inspector.getByTestId('inspector-rotate-all').click();
  for (const id of ['s', 'c']) await expect(page.locator(`.react-flow__node[data-id="${id}"] g[transform*="rotate(90)"]`)).toHaveCount(1);
  await page.screenshot({ path: 'test-results/inspector-03-two-selected.png' });

  // It sits atop the right-hand column; with that column hidden it floats over the canvas instead.
  await expect(inspector).toHaveAttribute('data-placement', 'panel');
  await page.getByTestId('toggle-panels').click();
  await expect(inspector).toHaveAttribute('data-placement', 'float');
  await expect(inspector.getByTestId('inspector-count')).toHaveText('2 parts selected');
  await page.screenshot({ path: 'test-results/inspector-03b-floating.png' });
});

test('the inspector sets a clock period and a note text; a viewer sees the fields without controls', async ({ page, browser, gatefold }) => {
  await page.setViewportSize({ width: 1400, height: 860 });
  await signUp(page, OWNER);
  const boardId = await importBoard(page, gatefold.baseURL);
  await openBoard(page, boardId);
  const inspector = page.getByTestId('part-inspector');

  await page.getByTestId('part-k').click();
  await expect(inspector.getByTestId('inspector-kind')).toHaveText('Clock');
  const period = inspector.getByTestId('inspector-period');
  await expect(period).toHaveValue(''); // no period: the simulator's default
  await period.fill('0');
  await period.press('Enter');
  await expect(inspector.getByRole('alert')).toContainText('must be a number above 0');
  await period.fill('40');
  await period.press('Enter');
  await expect(inspector.getByRole('alert')).toHaveCount(0);
  await expect(period).toHaveValue('40');
  await page.screenshot({ path: 'test-results/inspector-04-clock.png' });

  await page.getByTestId('part-n1').click();
  await expect(inspector.getByTestId('inspector-kind')).toHaveText('Text note');
  const text = inspector.getByTestId('inspector-text');
  await text.fill('Half adder: S = A xor B, C = A and B');
  await inspector.getByTestId('inspector-kind').click(); // leaving the box keeps the text
  await expect(page.getByTestId('part-n1')).toContainText('S = A xor B');
  await page.screenshot({ path: 'test-results/inspector-05-note.png' });

  // A viewer of the same board sees the owner's values, read-only.
  const viewer = await viewerPage(browser, gatefold, boardId, page);
  await viewer.getByTestId('part-k').click();
  const seen = viewer.getByTestId('part-inspector');
  await expect(seen.getByTestId('inspector-period')).toHaveText('40 time units');
  await expect(seen.locator('input, select, textarea, button')).toHaveCount(0);
  await viewer.screenshot({ path: 'test-results/inspector-06-viewer.png' });
});

async function viewerPage(browser: Browser, gatefold: GatefoldServer, boardId: number, owner: Page): Promise<Page> {
  const ctx = await browser.newContext({ baseURL: gatefold.baseURL, viewport: { width: 1400, height: 860 } });
  const viewer = await ctx.newPage();
  await signUp(viewer, VIEWER);
  const added = await owner.request.post(`/api/boards/${boardId}/members`, { headers: { Origin: gatefold.baseURL }, data: { email: VIEWER.email, role: 'viewer' } });
  expect(added.ok()).toBe(true);
  await openBoard(viewer, boardId);
  await expect(viewer.getByTestId('read-only-note')).toBeVisible();
  return viewer;
}
