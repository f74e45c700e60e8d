/**
 * The team library in the browser: a module is published from one board (the Library drawer at the foot
 * of the parts tray), placed on another board (copied in with its origin and version) where a lamp follows
 * a switch through it, published again from its open module (the module bar) after a port was added
 * inside, and "Update from library" brings the new version to the copy: the instance gets the new pin and
 * works through it. Published from the copy's board, the copy records the new version: no "Update from
 * library" for the module the entry was just published from. A viewer of the board sees neither the
 * drawer nor a publish button, and the server refuses their publish.
 */
import type { Locator, Page } from '@playwright/test';
import type { BoardFile } from '../../shared/board';
import { test, expect, signUp } from './fixtures';

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };
const VIEWER = { name: 'Theo Brand', email: 'theo@larkspur.example', password: 'grid-bias-minus-3' };

// A signal follower: port A through a buffer to port Y, so Y = A (common practice, no source).
const FOLLOWER: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Room 14 follower demo', family: 'ideal',
  parts: [
    { id: 's1', kind: 'switch', label: 'IN', on: false, x: 0, y: 0 },
    { id: 'u1', kind: 'module', module: 'follower', x: 160, y: 0 },
    { id: 'l1', kind: 'lamp', label: 'OUT', x: 400, y: 20 },
  ],
  wires: [{ id: 'w1', from: 's1.out', to: 'u1.A' }, { id: 'w2', from: 'u1.Y', to: 'l1.in' }],
  modules: [{
    id: 'follower', title: 'Signal follower',
    parts: [
      { id: 'pa', kind: 'port', dir: 'in', label: 'A', x: 0, y: 40 },
      { id: 'g1', kind: 'buffer', x: 160, y: 40 },
      { id: 'py', kind: 'port', dir: 'out', label: 'Y', x: 320, y: 40 },
    ],
    wires: [{ id: 'w1', from: 'pa.out', to: 'g1.in0' }, { id: 'w2', from: 'g1.out', to: 'py.in' }],
  }],
};

// The door bell of Room 14: a key switch and two lamps, nothing between them yet.
const BELL: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Room 14 door bell', family: 'ideal',
  parts: [
    { id: 'key', kind: 'switch', label: 'KEY', on: false, x: 0, y: 0 },
    { id: 'bell', kind: 'lamp', label: 'BELL', x: 480, y: 0 },
    { id: 'quiet', kind: 'lamp', label: 'QUIET', x: 480, y: 120 },
  ],
  wires: [],
};

async function importBoard(page: Page, board: BoardFile): Promise<number> {
  await page.goto('/boards');
  await page.getByTestId('import-board-input').setInputFiles({ name: 'board.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(board)) });
  await expect(page).toHaveURL(/\/boards\/\d+$/);
  await live(page);
  return Number(/\/boards\/(\d+)$/.exec(page.url())![1]);
}

async function live(page: Page): Promise<void> {
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  await expect(page.getByTestId('sync-note')).toHaveCount(0, { timeout: 15_000 });
}

async function clickCanvas(page: Page, fx: number, fy: number): Promise<void> {
  const box = (await page.locator('.react-flow__pane').boundingBox())!;
  await page.mouse.click(box.x + box.width * fx, box.y + box.height * fy);
}

/** Drags from one pin to another with the mouse (React Flow's connection gesture). */
async function wire(page: Page, from: Locator, to: Locator): Promise<void> {
  const a = (await from.boundingBox())!;
  const b = (await to.boundingBox())!;
  await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
  await page.mouse.down();
  await page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 5 });
  await page.mouse.move(b.x + b.width / 2, b.y + b.height / 2, { steps: 5 });
  await page.mouse.up();
}

const pin = (node: Locator, name: string) => node.locator(`[data-handleid="${name}"]`);
const lit = (page: Page, id: string) => page.getByTestId(`part-${id}`).locator('.gf-bulb');

test('publish a module, place it on another board, publish a new version, update the copy', async ({ page, browser, gatefold }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1400, height: 900 });
  await signUp(page, OWNER);

  // Board 1: the follower works; its module is not in the library yet. Publish it from the drawer.
  const board1 = await importBoard(page, FOLLOWER);
  await page.getByTestId('actuator-s1').click();
  await expect(lit(page, 'l1')).toHaveAttribute('data-lit', 'true');
  await page.getByTestId('library-toggle').click();
  const row = page.getByTestId('board-module-follower');
  await expect(row).toContainText('Signal follower');
  await expect(row.getByTestId('module-standing')).toHaveText('not in the library');
  await expect(page.getByTestId('library-content')).toContainText('No modules yet');
  await row.getByRole('button', { name: 'Publish to library' }).click();
  await expect(page.getByText('Published “Signal follower” to the library as v1')).toBeVisible();
  await expect(row.getByTestId('module-standing')).toHaveText('library v1');
  const entry = page.locator('[data-testid^="library-entry-"]');
  await expect(entry).toHaveCount(1);
  await expect(entry).toContainText('Signal follower');
  await expect(entry.getByTestId('library-version')).toHaveText('v1');
  const entryId = Number((await entry.getAttribute('data-testid'))!.replace('library-entry-', ''));
  // the board's module records what it now is in the library (it arrives as an edit of the open board)
  await expect(entry.getByTestId('library-copy')).toHaveText(' · on this board: v1');
  await expect(page.getByTestId(`library-update-${entryId}`)).toHaveCount(0);
  const published = await (await page.request.get(`/api/boards/${board1}/export`)).json() as BoardFile;
  expect(published.modules).toEqual([expect.objectContaining({ id: 'follower', origin: { library: String(entryId), version: 1 } })]);
  await page.getByTestId('library-drawer').screenshot({ path: 'test-results/library-01-drawer.png' });

  // Board 2: place it from the library; wired between the key and the bell, the bell follows the key.
  const board2 = await importBoard(page, BELL);
  await expect(page.locator('.gf-part[data-kind="module"]')).toHaveCount(0);
  await page.getByTestId('library-toggle').click();
  await page.getByTestId(`library-place-${entryId}`).click();
  await expect(page.getByText('Placed “Signal follower” v1 from the library')).toBeVisible();
  const instance = page.locator('.gf-part[data-kind="module"]');
  await expect(instance).toHaveCount(1);
  await expect(instance.getByTestId('instance-title')).toHaveText('Signal follower');
  await expect(page.getByTestId(`library-entry-${entryId}`).getByTestId('library-copy')).toHaveText(' · on this board: v1');
  await expect(page.getByTestId('board-module-follower').getByTestId('module-standing')).toHaveText('copy v1 · library v1');
  await expect(page.getByTestId(`library-update-${entryId}`)).toHaveCount(0);
  await wire(page, pin(page.getByTestId('part-key'), 'out'), pin(instance, 'A'));
  await wire(page, pin(instance, 'Y'), pin(page.getByTestId('part-bell'), 'in'));
  await expect(page.locator('.react-flow__edge')).toHaveCount(2);
  await expect(lit(page, 'bell')).toHaveAttribute('data-lit', 'false');
  await page.getByTestId('actuator-key').click();
  await expect(lit(page, 'bell')).toHaveAttribute('data-lit', 'true');
  await page.getByTestId('actuator-key').click();
  await expect(lit(page, 'bell')).toHaveAttribute('data-lit', 'false');
  // the copy is recorded in the board file with its origin and version
  const copy = await (await page.request.get(`/api/boards/${board2}/export`)).json() as BoardFile;
  expect(copy.modules).toEqual([expect.objectContaining({ id: 'follower', title: 'Signal follower', origin: { library: String(entryId), version: 1 } })]);

  // Back on board 1: open the module, add an inverter to a new output port, publish again from the module bar.
  await page.goto(`/boards/${board1}`);
  await live(page);
  await page.locator('.gf-part[data-kind="module"]').dblclick({ position: { x: 60, y: 14 } });
  await expect(page.getByTestId('breadcrumb-current')).toHaveText('Signal follower');
  await expect(page.getByTestId('module-bar-standing')).toHaveText('library v1');
  await page.getByTestId('tray-not').click();
  await clickCanvas(page, 0.5, 0.8);
  await page.getByTestId('tray-port-out').click();
  await clickCanvas(page, 0.75, 0.8);
  const inside = (kind: string) => page.locator(`.gf-part[data-kind="${kind}"]`);
  await expect(inside('port')).toHaveCount(3);
  await wire(page, pin(page.getByTestId('part-pa'), 'out'), pin(inside('not'), 'in0'));
  await wire(page, pin(inside('not'), 'out'), pin(inside('port').filter({ hasText: 'out1' }), 'in'));
  await expect(page.locator('.react-flow__edge')).toHaveCount(4);
  await page.getByTestId('module-bar').getByRole('button', { name: 'Publish to library' }).click();
  await expect(page.getByText('Published “Signal follower” to the library as v2')).toBeVisible();
  await expect(page.getByTestId('module-bar-standing')).toHaveText('library v2');
  await page.screenshot({ path: 'test-results/library-02-module-open.png' });

  // Board 2: the drawer offers the update; it brings v2 (a new pin, out1 = NOT A) to the copy.
  await page.goto(`/boards/${board2}`);
  await live(page);
  await page.getByTestId('library-toggle').click();
  await expect(page.getByTestId(`library-entry-${entryId}`).getByTestId('library-version')).toHaveText('v2');
  await expect(page.getByTestId('board-module-follower').getByTestId('module-standing')).toHaveText('copy v1 · library v2');
  await expect(instance.locator('.gf-pin-out')).toHaveCount(1);
  await page.getByTestId(`library-update-${entryId}`).click();
  await expect(page.getByText('Updated “Signal follower” on this board to v2')).toBeVisible();
  await expect(page.getByTestId(`library-entry-${entryId}`).getByTestId('library-copy')).toHaveText(' · on this board: v2');
  await expect(page.getByTestId(`library-update-${entryId}`)).toHaveCount(0);
  await expect(instance.locator('.gf-pin-out')).toHaveCount(2);
  await wire(page, pin(instance, 'out1'), pin(page.getByTestId('part-quiet'), 'in'));
  await expect(page.locator('.react-flow__edge')).toHaveCount(3);
  // key off: the bell dark, the new output (NOT A) lights QUIET; key on: the other way round
  await expect(lit(page, 'quiet')).toHaveAttribute('data-lit', 'true');
  await expect(lit(page, 'bell')).toHaveAttribute('data-lit', 'false');
  await page.getByTestId('actuator-key').click();
  await expect(lit(page, 'bell')).toHaveAttribute('data-lit', 'true');
  await expect(lit(page, 'quiet')).toHaveAttribute('data-lit', 'false');
  const updated = await (await page.request.get(`/api/boards/${board2}/export`)).json() as BoardFile;
  expect(updated.modules).toEqual([expect.objectContaining({ id: 'follower', origin: { library: String(entryId), version: 2 } })]);
  expect(updated.modules![0].parts.map((p) => p.kind).sort()).toEqual(['buffer', 'not', 'port', 'port', 'port']);
  await page.screenshot({ path: 'test-results/library-03-updated.png' });

  // Published again from this board's copy: the entry is v3, and the copy records v3 — it is what the
  // library holds, so no "Update from library" is offered for it.
  const copyRow = page.getByTestId('board-module-follower');
  await copyRow.getByRole('button', { name: 'Publish to library' }).click();
  await expect(page.getByText('Published “Signal follower” to the library as v3')).toBeVisible();
  await expect(page.getByTestId(`library-entry-${entryId}`).getByTestId('library-version')).toHaveText('v3');
  await expect(page.getByTestId(`library-entry-${entryId}`).getByTestId('library-copy')).toHaveText(' · on this board: v3');
  await expect(copyRow.getByTestId('module-standing')).toHaveText('library v3');
  await expect(page.getByTestId(`library-update-${entryId}`)).toHaveCount(0);
  const republished = await (await page.request.get(`/api/boards/${board2}/export`)).json() as BoardFile;
  expect(republished.modules).toEqual([expect.objectContaining({ id: 'follower', origin: { library: String(entryId), version: 3 } })]);

  // A viewer of board 2: no parts tray, no library drawer, no publish in the module bar; the server refuses it too.
  const headers = { Origin: gatefold.baseURL };
  const viewerContext = await browser.newContext({ baseURL: gatefold.baseURL });
  const viewer = await viewerContext.newPage();
  await viewer.setViewportSize({ width: 1400, height: 900 });
  await signUp(viewer, VIEWER);
  expect((await page.request.post(`/api/boards/${board2}/members`, { headers, data: { email: VIEWER.email, role: 'viewer' } })).ok()).toBe(true);
  await viewer.goto(`/boards/${board2}`);
  await live(viewer);
  await expect(viewer.getByTestId('read-only-note')).toBeVisible();
  await expect(viewer.getByTestId('parts-tray')).toHaveCount(0);
  await expect(viewer.getByTestId('library-drawer')).toHaveCount(0);
  await viewer.locator('.gf-part[data-kind="module"]').getByTestId('instance-title').dblclick();
  await expect(viewer.getByTestId('breadcrumb-current')).toHaveText('Signal follower');
  await expect(viewer.getByRole('button', { name: 'Publish to library' })).toHaveCount(0);
  const refused = await viewer.request.post('/api/library', { headers, data: { boardId: board2, moduleId: 'follower' } });
  expect(refused.status()).toBe(403);
  await viewerContext.close();
});
