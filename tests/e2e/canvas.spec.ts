import type { Browser, BrowserContext, Locator, Page } from '@playwright/test';
import { test, expect, signUp } from './fixtures';

// The live shared canvas end to end: three people on one board in three browser contexts, through the
// real server, database and collaboration socket. Demo names from our own scenario.

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };
const EDITOR = { name: 'Ines Okafor', email: 'ines@larkspur.example', password: 'slate-cool-0917' };
const VIEWER = { name: 'Tomas Reyes', email: 'tomas@room14.example', password: 'room-fourteen-77' };

async function person(browser: Browser, baseURL: string, who: typeof OWNER): Promise<{ ctx: BrowserContext; page: Page }> {
  const ctx = await browser.newContext({ baseURL, viewport: { width: 1400, height: 860 } });
  const page = await ctx.newPage();
  await signUp(page, who);
  return { ctx, page };
}

async function openBoard(page: Page, id: number): Promise<void> {
  await page.goto(`/boards/${id}`);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  await expect(page.getByTestId('sync-note')).toHaveCount(0, { timeout: 15_000 });
}

/** Clicks the empty canvas at (fx, fy) as fractions of its box. */
async function clickCanvas(page: Page, fx: number, fy: number): Promise<void> {
  const box = (await page.locator('.react-flow__pane').boundingBox())!;
  await page.mouse.click(box.x + box.width * fx, box.y + box.height * fy);
}

async function partIds(page: Page, prefix: string): Promise<string[]> {
  const ids = await page.locator(`[data-testid^="part-${prefix}"]`).evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')!.slice(5)));
  return ids.sort();
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

/** The translate() of a node on the canvas (its position as drawn). */
async function nodePos(page: Page, id: string): Promise<string> {
  const style = (await page.locator(`.react-flow__node[data-id="${id}"]`).getAttribute('style')) ?? '';
  return /translate\([^)]*\)/.exec(style)?.[0] ?? '';
}

async function nodeTransform(page: Page, id: string): Promise<string | null> {
  return page.locator(`.react-flow__node[data-id="${id}"]`).getAttribute('style');
}

test('owner and editor edit one board live; undo is per person; a viewer cannot edit', async ({ browser, gatefold }) => {
  test.setTimeout(120_000);
  const owner = await person(browser, gatefold.baseURL, OWNER);
  // State-changing API calls carry our Origin, as a browser's would (the server's forgery guard asks for it).
  const headers = { Origin: gatefold.baseURL };
  const created = await owner.page.request.post('/api/boards', { data: { title: 'Half adder, canvas test' }, headers });
  expect(created.status()).toBe(201);
  const boardId = ((await created.json()) as { board: { id: number } }).board.id;
  const editor = await person(browser, gatefold.baseURL, EDITOR);
  const viewer = await person(browser, gatefold.baseURL, VIEWER);
  for (const [who, role] of [[EDITOR, 'editor'], [VIEWER, 'viewer']] as const) {
    const res = await owner.page.request.post(`/api/boards/${boardId}/members`, { data: { email: who.email, role }, headers });
    expect(res.ok()).toBeTruthy();
  }

  const o = owner.page;
  const e = editor.page;
  await openBoard(o, boardId);
  await openBoard(e, boardId);
  await expect(o.getByTestId('parts-tray')).toBeVisible();

  // Both see each other on the board.
  await expect(o.getByTestId('presence-avatar')).toHaveCount(2);
  await expect(e.getByTestId('presence-avatar')).toHaveCount(2);

  // The owner places a toggle switch by click-then-click; the editor sees it.
  await o.getByTestId('tray-switch').click();
  await clickCanvas(o, 0.25, 0.4);
  await expect.poll(() => partIds(o, 'sw')).toHaveLength(1);
  const [sw] = await partIds(o, 'sw');
  await expect(e.getByTestId(`part-${sw}`)).toBeVisible();
  await expect(e.getByTestId(`part-${sw}`)).toContainText('A');

  // The editor drags a lamp from the tray onto the canvas; the owner sees it.
  const pane = e.locator('.react-flow__pane');
  const pbox = (await pane.boundingBox())!;
  await e.getByTestId('tray-lamp').dragTo(pane, { targetPosition: { x: pbox.width * 0.6, y: pbox.height * 0.4 } });
  await expect.poll(() => partIds(e, 'lamp')).toHaveLength(1);
  const [lamp] = await partIds(e, 'lamp');
  await expect(o.getByTestId(`part-${lamp}`)).toBeVisible();

  // The owner wires switch.out to lamp.in; the wire shows on both screens.
  await wire(o, o.getByTestId(`pin-${sw}-out`), o.getByTestId(`pin-${lamp}-in`));
  await expect(o.locator('.react-flow__edge')).toHaveCount(1);
  await expect(e.locator('.react-flow__edge')).toHaveCount(1);

  // The rules: an input takes one wire — the second attempt is refused with the reason.
  await wire(o, o.getByTestId(`pin-${sw}-outn`), o.getByTestId(`pin-${lamp}-in`));
  await expect(o.getByText(/already has a wire/)).toBeVisible();
  await expect(o.locator('.react-flow__edge')).toHaveCount(1);

  // The owner's pointer shows on the editor's screen with the owner's name.
  await o.mouse.move(pbox.x + 300, pbox.y + 300);
  await o.mouse.move(pbox.x + 320, pbox.y + 310, { steps: 3 });
  await expect(e.getByTestId('remote-cursor').filter({ hasText: OWNER.name })).toBeVisible();
  await o.screenshot({ path: 'test-results/canvas-01-owner.png' });
  await e.screenshot({ path: 'test-results/canvas-02-editor.png' });

  // Undo in the owner's tab removes the owner's wire, then the owner's switch — never the editor's lamp.
  await o.locator('.react-flow__pane').click({ position: { x: 10, y: 10 } });
  await o.keyboard.press('Control+z');
  await expect(o.locator('.react-flow__edge')).toHaveCount(0);
  await expect(e.locator('.react-flow__edge')).toHaveCount(0);
  await o.getByTestId('tool-undo').click();
  await expect(e.getByTestId(`part-${sw}`)).toHaveCount(0);
  // Nothing of the owner's is left to undo: the button is disabled and Ctrl+Z leaves the editor's lamp alone.
  await expect(o.getByTestId('tool-undo')).toBeDisabled();
  await o.keyboard.press('Control+z');
  await o.waitForTimeout(300);
  await expect(o.getByTestId(`part-${lamp}`)).toBeVisible();
  await expect(e.getByTestId(`part-${lamp}`)).toBeVisible();
  // Redo brings the switch back for everyone.
  await o.keyboard.press('Control+Shift+z');
  await expect(e.getByTestId(`part-${sw}`)).toBeVisible();

  // A drag shows on the other screen while it happens (through presence), and lands where it was dropped.
  const lb = (await o.getByTestId(`part-${lamp}`).boundingBox())!;
  const startE = await nodePos(e, lamp);
  await o.mouse.move(lb.x + lb.width * 0.6, lb.y + lb.height / 2);
  await o.mouse.down();
  await o.mouse.move(lb.x + 80, lb.y + 100, { steps: 10 });
  await expect.poll(() => nodePos(e, lamp)).not.toBe(startE);
  await o.mouse.up();
  await expect.poll(() => nodePos(e, lamp)).toBe(await nodePos(o, lamp));
  // …and the owner's selection is outlined in the owner's colour on the editor's screen.
  await expect(e.getByTestId(`part-${lamp}`)).toHaveAttribute('style', /box-shadow/);

  // Copy and paste (Ctrl+C / Ctrl+V) through the canvas clipboard: a second lamp with a fresh id and label.
  await e.getByTestId(`part-${lamp}`).click();
  await e.keyboard.press('Control+c');
  await e.mouse.move(pbox.x + pbox.width * 0.6, pbox.y + pbox.height * 0.7);
  await e.keyboard.press('Control+v');
  await expect.poll(() => partIds(o, 'lamp')).toHaveLength(2);

  // The viewer: no tray, read-only note, dragging and Delete do nothing.
  const v = viewer.page;
  await openBoard(v, boardId);
  await expect(v.getByTestId('parts-tray')).toHaveCount(0);
  await expect(v.getByTestId('read-only-note')).toBeVisible();
  await expect(v.getByTestId(`part-${lamp}`)).toBeVisible();
  const before = await nodeTransform(v, lamp);
  const lbox = (await v.getByTestId(`part-${lamp}`).boundingBox())!;
  await v.mouse.move(lbox.x + lbox.width / 2, lbox.y + lbox.height / 2);
  await v.mouse.down();
  await v.mouse.move(lbox.x + 200, lbox.y + 120, { steps: 8 });
  await v.mouse.up();
  expect(await nodeTransform(v, lamp)).toBe(before);
  await v.getByTestId(`part-${lamp}`).click();
  await v.keyboard.press('Delete');
  await v.keyboard.press('Control+d');
  await v.waitForTimeout(500);
  await expect(o.getByTestId(`part-${lamp}`)).toBeVisible();
  await expect(v.getByTestId(`part-${lamp}`)).toBeVisible();
  expect(await partIds(o, 'lamp')).toHaveLength(2);
  // …but the viewer still gets live updates: the owner deletes the switch and it leaves the viewer's screen.
  await o.getByTestId(`part-${sw}`).click();
  await o.keyboard.press('Delete');
  await expect(v.getByTestId(`part-${sw}`)).toHaveCount(0);
  await v.screenshot({ path: 'test-results/canvas-03-viewer.png' });

  // The help sheet lists the shortcuts.
  await o.keyboard.press('?');
  await expect(o.getByTestId('help-sheet')).toContainText('Ctrl+Shift+Z');
  await o.screenshot({ path: 'test-results/canvas-04-help.png' });
  await o.keyboard.press('Escape');

  for (const p of [owner, editor, viewer]) await p.ctx.close();
});

// The half adder of CONTRACTS §1 (our own example).
const HALF_ADDER = {
  format: 'gatefold-board', version: 1, title: 'Half adder', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'A', x: 40, y: 40, on: false },
    { id: 'b', kind: 'switch', label: 'B', x: 40, y: 140, on: false },
    { id: 'g1', kind: 'xor', inputs: 2, x: 200, y: 40 },
    { id: 'g2', kind: 'and', inputs: 2, x: 200, y: 140 },
    { id: 's', kind: 'lamp', label: 'S', x: 360, y: 60 },
    { id: 'c', kind: 'lamp', label: 'C', x: 360, y: 160 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'g1.in0' }, { id: 'w2', from: 'b.out', to: 'g1.in1' },
    { id: 'w3', from: 'a.out', to: 'g2.in0' }, { id: 'w4', from: 'b.out', to: 'g2.in1' },
    { id: 'w5', from: 'g1.out', to: 's.in' }, { id: 'w6', from: 'g2.out', to: 'c.in' },
  ],
};

test('board files and pictures: import into a new board (errors name the bad ids), export file, PNG and SVG', async ({ page }) => {
  test.setTimeout(90_000);
  await signUp(page, OWNER);
  await expect(page).toHaveURL(/\/boards$/);

  // A file whose wire runs to a missing part is refused, and the message names the wire and the part.
  const broken = { ...HALF_ADDER, wires: [...HALF_ADDER.wires, { id: 'w9', from: 'g2.out', to: 'zz.in' }] };
  await page.getByTestId('import-board-input').setInputFiles({ name: 'broken.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(broken)) });
  await expect(page.getByText(/w9: wire to missing part "zz"/).first()).toBeVisible();
  await expect(page).toHaveURL(/\/boards$/);

  // A good file becomes a new board, which opens.
  await page.getByTestId('import-board-input').setInputFiles({ name: 'half-adder.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(HALF_ADDER)) });
  await expect(page).toHaveURL(/\/boards\/\d+$/);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  for (const id of ['a', 'b', 'g1', 'g2', 's', 'c']) await expect(page.getByTestId(`part-${id}`)).toBeVisible();
  await expect(page.locator('.react-flow__edge')).toHaveCount(6);

  // Flipping switch A on (a click on its face) lights S = A xor B through the live simulation.
  // Half adder: S = A ⊕ B, C = A·B (any digital-logic textbook; common practice, no source).
  await expect(page.getByTestId('part-s').locator('.gf-bulb')).toHaveAttribute('data-lit', 'false');
  await page.getByTestId('actuator-a').click();
  await expect(page.getByTestId('part-s').locator('.gf-bulb')).toHaveAttribute('data-lit', 'true');
  await expect(page.getByTestId('part-c').locator('.gf-bulb')).toHaveAttribute('data-lit', 'false');

  // A wire is selected by a click and deleted with Delete; undo brings it back.
  // (a wire may have a zero-height box, which Playwright counts as hidden: click its middle directly)
  await page.locator('.react-flow__edge[data-id="w5"]').click({ force: true });
  await page.keyboard.press('Delete');
  await expect(page.locator('.react-flow__edge')).toHaveCount(5);
  await expect(page.getByTestId('part-s').locator('.gf-bulb')).toHaveAttribute('data-lit', 'false');
  await page.keyboard.press('Control+z');
  await expect(page.locator('.react-flow__edge')).toHaveCount(6);
  await expect(page.getByTestId('part-s').locator('.gf-bulb')).toHaveAttribute('data-lit', 'true');

  // Double-click renames a part in place; a label already in use is refused with the part that has it.
  await page.getByTestId('part-s').dblclick();
  await page.getByTestId('label-edit-s').fill('C');
  await page.getByTestId('label-edit-s').press('Enter');
  await expect(page.getByText('label "C" is already on c')).toBeVisible();
  await page.getByTestId('part-s').dblclick();
  await page.getByTestId('label-edit-s').fill('SUM');
  await page.getByTestId('label-edit-s').press('Enter');
  await expect(page.getByTestId('part-s').locator('.gf-label')).toHaveText('SUM');

  // Copy in this tab, paste in another tab: the fragment travels on the system clipboard.
  await page.getByTestId('part-g1').click({ position: { x: 50, y: 30 } });
  await page.keyboard.press('Control+c');
  const other = await page.context().newPage();
  await other.goto(page.url());
  await expect(other.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  await expect(other.getByTestId('part-g1')).toBeVisible();
  const obox = (await other.locator('.react-flow__pane').boundingBox())!;
  await other.mouse.move(obox.x + obox.width * 0.5, obox.y + obox.height * 0.8);
  await other.keyboard.press('Control+v');
  await expect(page.locator('[data-kind="xor"]')).toHaveCount(2);
  await other.keyboard.press('Control+z');
  await expect(page.locator('[data-kind="xor"]')).toHaveCount(1);
  await other.close();

  // R turns the selected gate a quarter turn: its box swaps width and height.
  const before = (await page.getByTestId('part-g2').boundingBox())!;
  await page.getByTestId('part-g2').click({ position: { x: 50, y: 30 } });
  await page.keyboard.press('r');
  await expect.poll(async () => Math.round((await page.getByTestId('part-g2').boundingBox())!.width)).toBe(Math.round(before.height));
  await page.screenshot({ path: 'test-results/canvas-05-imported-half-adder.png' });

  // The board file downloads with the board's content (the switch now on, the gate turned).
  const [file] = await Promise.all([page.waitForEvent('download'), page.getByTestId('tool-export-file').click()]);
  expect(file.suggestedFilename()).toBe('half-adder.gatefold.json');
  const saved = JSON.parse(await streamText(await file.createReadStream())) as typeof HALF_ADDER;
  expect(saved.parts.map((p) => p.id)).toEqual(['a', 'b', 'g1', 'g2', 's', 'c']);
  expect(saved.parts[0]).toMatchObject({ id: 'a', on: true });
  expect(saved.parts[3]).toMatchObject({ id: 'g2', rotation: 90 });
  expect(saved.parts[4]).toMatchObject({ id: 's', label: 'SUM' });
  expect(saved.wires).toEqual(HALF_ADDER.wires);

  // PNG (its 8-byte signature, PNG specification ISO/IEC 15948 §5.2 — from memory) and SVG pictures.
  const [png] = await Promise.all([page.waitForEvent('download'), page.getByTestId('tool-export-png').click()]);
  expect(png.suggestedFilename()).toBe('half-adder.png');
  const pngBytes = await streamBytes(await png.createReadStream());
  expect([...pngBytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  expect(pngBytes.length).toBeGreaterThan(2000);
  const [svg] = await Promise.all([page.waitForEvent('download'), page.getByTestId('tool-export-svg').click()]);
  expect(svg.suggestedFilename()).toBe('half-adder.svg');
  const svgText = await streamText(await svg.createReadStream());
  expect(svgText).toContain('<svg');
  // real vector drawing from the shared renderer: each part a group of shapes, no HTML inside
  expect(svgText).toContain('data-part="g1"');
  expect(svgText).not.toContain('foreignObject');
});

async function streamBytes(stream: NodeJS.ReadableStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.from(chunk as Buffer));
  return Buffer.concat(chunks);
}
async function streamText(stream: NodeJS.ReadableStream): Promise<string> {
  return (await streamBytes(stream)).toString('utf8');
}

test('an editor who drops off the network keeps editing; the edits reach the others on reconnect', async ({ browser, gatefold }) => {
  test.setTimeout(90_000);
  const owner = await person(browser, gatefold.baseURL, OWNER);
  const headers = { Origin: gatefold.baseURL };
  const created = await owner.page.request.post('/api/boards', { data: { title: 'Debounced clock' }, headers });
  const boardId = ((await created.json()) as { board: { id: number } }).board.id;
  const editor = await person(browser, gatefold.baseURL, EDITOR);
  await owner.page.request.post(`/api/boards/${boardId}/members`, { data: { email: EDITOR.email, role: 'editor' }, headers });
  const o = owner.page;
  const e = editor.page;
  await openBoard(o, boardId);
  // the editor's history panel and timing strip cannot be fetched (as when the connection drops before a
  // panel's code arrives): each shows a note in its place and the board goes on working (below, offline);
  // a reload at the end brings them back
  const chunks = /\/assets\/(history-panel|timing-strip)-[^/]*\.js$/;
  await e.route(chunks, (route) => route.abort('internetdisconnected'));
  await openBoard(e, boardId);
  const notes = e.getByText(/could not be loaded: the connection was lost/);
  await expect(notes).toHaveCount(2, { timeout: 20_000 });
  await expect(e.getByText(/The timing strip could not be loaded/)).toBeVisible();
  await e.unroute(chunks);

  await editor.ctx.setOffline(true);
  await expect(e.getByTestId('connection-status')).not.toHaveAttribute('data-status', 'live', { timeout: 20_000 });
  await e.getByTestId('tray-nand').click();
  await clickCanvas(e, 0.4, 0.4);
  await expect.poll(() => partIds(e, 'g')).toHaveLength(1);
  const [gate] = await partIds(e, 'g');
  await o.waitForTimeout(1000);
  await expect(o.getByTestId(`part-${gate}`)).toHaveCount(0);
  await e.screenshot({ path: 'test-results/canvas-06-editor-offline.png' });

  await editor.ctx.setOffline(false);
  await expect(e.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 30_000 });
  await expect(o.getByTestId(`part-${gate}`)).toBeVisible({ timeout: 15_000 });
  await e.reload();
  await expect(e.getByRole('button', { name: 'Export VCD' })).toBeVisible({ timeout: 20_000 });
  await expect(notes).toHaveCount(0);
  await expect(e.getByTestId(`part-${gate}`)).toBeVisible();
  for (const p of [owner, editor]) await p.ctx.close();
});
