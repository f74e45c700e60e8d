import { readFileSync } from 'node:fs';
import type { Browser, Page } from '@playwright/test';
import { expect, signIn, signUp, test, type GatefoldServer } from './fixtures';

// What a newcomer meets on the first evening, in real Chromium against the real server: the demo boards
// (the debounced clock counts presses, a viewer's clock step is a try-out, the Verilog download, one colour
// per person, a collaborator who drops off, the delete dialog, revoking an invitation) and a board of
// their own with a gate fed back on itself (the wire drawn around it, the lamp shown oscillating, parts
// named by kind and number, the analysis saying "unknown", the wording).

const DEMO_PASSWORD = 'gatefold-demo';
const level = (page: Page, row: string) => page.getByTestId(row).locator('[data-level]').first();
const shot = (page: Page, name: string) => page.screenshot({ path: `test-results/newcomer-${name}.png` });

async function boardId(page: Page, title: string): Promise<number> {
  const res = await page.request.get('/api/boards');
  const { boards } = (await res.json()) as { boards: { id: number; title: string }[] };
  const board = boards.find((b) => b.title === title);
  if (!board) throw new Error(`no board "${title}"`);
  return board.id;
}

async function person(browser: Browser, gatefold: GatefoldServer, email: string): Promise<Page> {
  const context = await browser.newContext({ baseURL: gatefold.baseURL, viewport: { width: 1500, height: 950 } });
  const page = await context.newPage();
  await signIn(page, email, DEMO_PASSWORD);
  return page;
}

/** Holds the push button on the canvas for a moment, then lets go. */
async function press(page: Page, partId: string): Promise<void> {
  const actuator = page.getByTestId(`actuator-${partId}`);
  await actuator.scrollIntoViewIfNeeded();
  await actuator.hover();
  await page.mouse.down();
  await page.waitForTimeout(150);
  await page.mouse.up();
}

test.describe('the demo boards', () => {
  test.use({ seedDemo: true });

  test('the debounced clock counts two presses as two; exports, colours, presence, dialogs', async ({ page, browser, gatefold }) => {
    await page.setViewportSize({ width: 1500, height: 950 });
    await signIn(page, 'theo@larkspur.example', DEMO_PASSWORD);
    const clockId = await boardId(page, 'Debounced clock');
    await page.goto(`/boards/${clockId}`);
    await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 20_000 });
    await expect(level(page, 'bench-output-C0')).toHaveAttribute('data-level', '0');

    // Two presses of the one changeover button: the count reads 2 (C1 C0 = 1 0), the bounce added nothing.
    await press(page, 'push');
    await expect(level(page, 'bench-output-C0')).toHaveAttribute('data-level', '1');
    await press(page, 'push');
    await expect(level(page, 'bench-output-C1')).toHaveAttribute('data-level', '1');
    await expect(level(page, 'bench-output-C0')).toHaveAttribute('data-level', '0');
    await expect(level(page, 'bench-output-CLEAN')).toHaveAttribute('data-level', '0');
    await shot(page, '01-debounced-clock-two-presses');

    // The file menu downloads the board as Verilog.
    const [verilog] = await Promise.all([page.waitForEvent('download'), page.getByTestId('tool-export-verilog').click()]);
    expect(verilog.suggestedFilename()).toBe('debounced-clock.v');
    const text = readFileSync((await verilog.path())!, 'utf8');
    expect(text).toMatch(/^module Debounced_clock \(PUSH, RAW, CLEAN, C0, C1\);$/m);
    expect(text).toContain('not ');

    // The board picture (the snapshots work's renderer): framed to the parts, real vector shapes.
    const [svg] = await Promise.all([page.waitForEvent('download'), page.getByTestId('tool-export-svg').click()]);
    const picture = readFileSync((await svg.path())!, 'utf8');
    expect(picture).not.toContain('foreignObject');
    const viewBox = /viewBox="([-\d.]+) ([-\d.]+) ([\d.]+) ([\d.]+)"/.exec(picture)!.slice(1).map(Number);
    // the parts span x 40…980, y 60…460 (the example file): the frame holds them with a margin, no more
    expect(viewBox[2]).toBeGreaterThan(940);
    expect(viewBox[2]).toBeLessThan(1300);
    expect(viewBox[3]).toBeLessThan(800);

    // One person, one colour: Ines's disc in the presence bar and her avatar in the members list agree.
    const ines = await person(browser, gatefold, 'ines@larkspur.example');
    await ines.goto(`/boards/${clockId}`);
    await expect(ines.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 20_000 });
    const inesDisc = page.getByTestId('presence-bar').getByTestId('presence-avatar').filter({ hasText: 'IO' });
    await expect(inesDisc).toHaveCount(1);
    const inesInList = page.getByTestId('member-list').locator('li').filter({ hasText: 'Ines Okafor' }).getByTestId('avatar');
    await expect(inesInList).toHaveAttribute('data-color', (await inesDisc.getAttribute('data-color'))!);
    const theoDisc = ines.getByTestId('presence-bar').getByTestId('presence-avatar').filter({ hasText: 'TV' });
    await expect(theoDisc).not.toHaveAttribute('data-away', 'true');
    await shot(page, '02-presence-and-members');

    // Ines drops off the network: her own bar greys Theo at once; Theo's bar lets her go (greyed or gone).
    await ines.context().setOffline(true);
    await expect(theoDisc).toHaveAttribute('data-away', 'true');
    await ines.screenshot({ path: 'test-results/newcomer-03-offline-own-view.png' });
    await expect(async () => {
      const discs = await inesDisc.count();
      expect(discs === 0 || (await inesDisc.getAttribute('data-away')) === 'true').toBe(true);
    }).toPass({ timeout: 45_000 });
    await shot(page, '04-collaborator-offline');
    await ines.context().close();

    // The delete dialog closes with Esc, and the board is still there.
    await page.getByTestId('board-page').locator('header').getByRole('button', { name: 'Delete' }).click();
    const dialog = page.getByRole('dialog', { name: 'Delete “Debounced clock”?' });
    await expect(dialog).toBeVisible();
    await shot(page, '05-delete-dialog');
    await page.keyboard.press('Escape');
    await expect(dialog).toBeHidden();
    await expect(page.getByTestId('part-push')).toBeVisible();

    // The owner invites an address, then revokes the pending invitation.
    await page.goto(`/boards/${clockId}/members`);
    const add = page.getByRole('form', { name: 'Add member' });
    await add.getByLabel('E-mail', { exact: true }).fill('newcomer@room14.example');
    await add.getByRole('button', { name: 'Add member' }).click();
    const pending = page.getByTestId('invitation-list');
    await expect(pending).toContainText('newcomer@room14.example');
    await pending.getByRole('button', { name: 'Revoke the invitation to newcomer@room14.example' }).click();
    await shot(page, '06-revoke-confirm');
    await page.getByRole('button', { name: 'Revoke invitation' }).click();
    await expect(page.getByText('No pending invitations.')).toBeVisible();
  });

  test('a viewer\'s own clock step is a try-out', async ({ browser, gatefold }) => {
    const sam = await person(browser, gatefold, 'sam@room14.example');
    await sam.goto('/boards');
    await sam.goto(`/boards/${await boardId(sam, '4-bit ripple counter')}`);
    await expect(sam.getByTestId('read-only-note')).toBeVisible();
    await expect(sam.getByTestId('bench-cycles')).toHaveText('cycle 0');
    await expect(sam.getByTestId('try-out-chip')).toHaveCount(0);
    await sam.getByTestId('bench-panel').getByRole('button', { name: 'Step' }).click();
    await expect(sam.getByTestId('bench-cycles')).toHaveText('cycle 1');
    await expect(sam.getByTestId('try-out-chip')).toBeVisible();
    await expect(level(sam, 'bench-output-Q0')).toHaveAttribute('data-level', '1');
    await sam.getByTestId('bench-panel').screenshot({ path: 'test-results/newcomer-07-viewer-step-try-out.png' });
    await sam.getByTestId('try-out-chip').getByRole('button', { name: 'Reset' }).click();
    await expect(sam.getByTestId('try-out-chip')).toHaveCount(0);
    await expect(level(sam, 'bench-output-Q0')).toHaveAttribute('data-level', '0');
  });
});

test('a gate fed back on itself: drawn around, oscillating, named, unknown; the wording', async ({ page, gatefold }) => {
  await page.setViewportSize({ width: 1500, height: 950 });
  await signUp(page, { name: 'Priya Nair', email: 'priya.ring@room14.example', password: 'ring-of-one-77' });
  const board = {
    format: 'gatefold-board', version: 1, title: 'Ring of one', family: 'ideal',
    parts: [
      { id: 'a', kind: 'switch', label: 'A', x: 40, y: 40, on: false }, { id: 'b', kind: 'switch', label: 'B', x: 40, y: 140, on: false },
      { id: 's', kind: 'switch', label: 'S', x: 40, y: 240, on: false },
      { id: 'g1_ekm', kind: 'not', x: 300, y: 360 }, { id: 'y', kind: 'lamp', x: 520, y: 360 },
      { id: 'h', kind: 'and', inputs: 2, x: 300, y: 60 }, { id: 'q', kind: 'lamp', label: 'Q', x: 520, y: 80 },
      { id: 'open', kind: 'not', x: 300, y: 200 },
    ],
    wires: [
      { id: 'w1', from: 'g1_ekm.out', to: 'g1_ekm.in0' }, { id: 'w2', from: 'g1_ekm.out', to: 'y.in' },
      { id: 'w3', from: 'a.out', to: 'h.in0' }, { id: 'w4', from: 'b.out', to: 'h.in1' }, { id: 'w5', from: 'h.out', to: 'q.in' },
    ],
  };
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: gatefold.baseURL },
    multipart: { file: { name: 'ring.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(board)) } },
  });
  expect(imported.status()).toBe(201);
  const { board: created } = (await imported.json()) as { board: { id: number } };
  await page.goto(`/boards/${created.id}`);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 20_000 });

  // The self-loop wire runs around the gate: above its top and beyond both sides, not through its body.
  const gate = (await page.getByTestId('part-g1_ekm').boundingBox())!;
  const loop = (await page.locator('.react-flow__edge[data-id="w1"] path.react-flow__edge-path').boundingBox())!;
  expect(loop.y).toBeLessThan(gate.y);
  expect(loop.x).toBeLessThan(gate.x);
  expect(loop.x + loop.width).toBeGreaterThan(gate.x + gate.width);

  // The unlabelled lamp on the ring: named "Lamp 1" (id in the tooltip), shown oscillating, bench and canvas.
  const lampRow = page.getByTestId('bench-output-y');
  await expect(lampRow).toHaveAttribute('data-oscillating', 'true');
  await expect(lampRow).toContainText('Lamp 1');
  await expect(lampRow).toContainText('oscillating');
  await expect(lampRow.getByTitle('id y')).toBeVisible();
  await expect.poll(() => page.getByTestId('net-pulse-style').textContent()).toContain('.react-flow__node[data-id="y"] .gf-bulb');
  // status lines: parts by kind and number, the family's name not mid-sentence
  const status = page.getByTestId('settle-status');
  await expect(status).toContainText('NOT 1 out');
  await expect(status).not.toContainText('g1_ekm');
  await expect(status).toContainText('Undriven inputs (Ideal (unit delay): an open input reads X)');
  await expect(status).toContainText('NOT 2 in0');
  await page.locator('.react-flow__node[data-id="g1_ekm"]').scrollIntoViewIfNeeded();
  await shot(page, '08-ring-of-one');

  // The analysis: Lamp 1 is X in every row, so no expression, said plainly.
  const panel = page.getByTestId('analysis-panel');
  await panel.scrollIntoViewIfNeeded();
  await expect(panel.getByTestId('analysis-status')).toContainText('8 rows', { timeout: 15_000 });
  await expect(panel.getByTestId('unknown-y')).toContainText('Unknown');
  await expect(panel.getByTestId('sop-y')).toHaveCount(0);
  // the function map over A, B names no "(A = A, B = B)"
  await panel.getByTestId('pick-select').getByLabel('S').check();
  await expect(panel.getByTestId('function-map')).toContainText('data A, B');
  await expect(panel.getByTestId('function-map')).not.toContainText('A = A');
  await panel.screenshot({ path: 'test-results/newcomer-09-analysis-unknown.png' });
  // one row, not "1 rows"
  for (const input of ['A', 'B', 'S']) await panel.getByTestId('pick-inputs').getByLabel(input).uncheck();
  await expect(panel.getByTestId('analysis-status')).toContainText(/^1 row in/);
  await expect(panel.getByTestId('pick-inputs')).toContainText('Inputs (0, 1 row)');

  // A board file with an unknown kind: the problem is said once.
  const bad = { ...board, parts: [...board.parts, { id: 't1', kind: 'triode', x: 700, y: 40 }] };
  await page.getByTestId('import-board-input').setInputFiles({ name: 'bad.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(bad)) });
  const toast = page.locator('[data-sonner-toast]').filter({ hasText: 'Import refused' });
  await expect(toast).toBeVisible();
  expect(((await toast.textContent()) ?? '').split('unknown kind "triode"').length - 1).toBe(1);
  await shot(page, '10-import-refused');
});
