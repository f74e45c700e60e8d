import { readFileSync } from 'node:fs';
import type { Page } from '@playwright/test';
import { test, expect, signUp } from './fixtures';

// Zoomed out, the canvas paints the parts and wires itself (plain boxes on one <canvas>, flow/far-canvas.tsx)
// instead of a React Flow node and edge each. Selecting and dragging a part still work there (hit-tested
// presses), a drag reaches the document, and zooming in brings back the full parts with the selection kept.
// The canvas says on its element what it painted (data-parts, data-wires, data-titles) and a live region
// beside it reads out the selection. Demo names from our own scenario.

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };

/** Screen position of the flow point (x, y) for the view as it is now. */
async function screenAt(page: Page, x: number, y: number): Promise<{ x: number; y: number }> {
  const [tx, ty, zoom] = await page.locator('.react-flow__viewport').evaluate((el) => {
    const m = new DOMMatrixReadOnly(getComputedStyle(el).transform);
    return [m.e, m.f, m.a];
  });
  const root = (await page.locator('.react-flow').boundingBox())!;
  return { x: root.x + tx + x * zoom, y: root.y + ty + y * zoom };
}

/** 120 parts spread over a wide area, so that fit-to-view is far below the detail zoom: switch → lamp pairs. */
function wideBoard() {
  const parts: object[] = [];
  const wires: object[] = [];
  for (let i = 0; i < 60; i++) {
    const x = (i % 10) * 900;
    const y = Math.floor(i / 10) * 900;
    parts.push({ id: `s${i}`, kind: 'switch', label: `S${i}`, x, y, on: i % 2 === 0 });
    parts.push({ id: `l${i}`, kind: 'lamp', label: `L${i}`, x: x + 300, y: y + 20 });
    wires.push({ id: `w${i}`, from: `s${i}.out`, to: `l${i}.in` });
  }
  return { format: 'gatefold-board', version: 1, title: 'Wide bench board', family: 'ideal', parts, wires };
}

test('zoomed out: parts drawn as one layer, selected and dragged there; zooming in keeps the selection', async ({ page, baseURL }) => {
  test.setTimeout(90_000);
  await signUp(page, OWNER);
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: baseURL! },
    multipart: { file: { name: 'wide.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(wideBoard())) } },
  });
  expect(imported.status()).toBe(201);
  const id = ((await imported.json()) as { board: { id: number } }).board.id;
  await page.goto(`/boards/${id}`);
  await expect(page.getByTestId('sync-note')).toHaveCount(0, { timeout: 15_000 });

  // fitted far below the detail zoom: every part a box painted on the far canvas, no React Flow node in the page
  const far = page.getByTestId('far-canvas');
  await expect(far).toHaveAttribute('data-parts', '120');
  await expect(far).toHaveAttribute('data-wires', '60');
  await expect(far).toHaveAttribute('role', 'img');
  await expect(page.locator('.react-flow__node')).toHaveCount(0);
  const said = page.getByTestId('far-selection');
  await expect(said).toHaveText('No part selected');

  // a click selects the part (alone); Ctrl adds another (switches are 80 × 60, lamps 60 × 40: their middles)
  const s5 = await screenAt(page, 4500 + 40, 30);
  await page.mouse.click(s5.x, s5.y);
  await expect(said).toHaveText('1 part selected: S5');
  const l7 = await screenAt(page, 6600 + 30, 20 + 20);
  await page.keyboard.down('Control');
  await page.mouse.click(l7.x, l7.y);
  await page.keyboard.up('Control');
  await expect(said).toHaveText('2 parts selected: S5, L7');
  const s9 = await screenAt(page, 8100 + 40, 30);
  await page.mouse.click(s9.x, s9.y);
  await expect(said).toHaveText('1 part selected: S9');
  // a click on empty canvas clears it
  const empty = await screenAt(page, 4500 + 450, 450);
  await page.mouse.click(empty.x, empty.y);
  await expect(said).toHaveText('No part selected');
  await page.mouse.click(s9.x, s9.y);
  await expect(said).toHaveText('1 part selected: S9');

  // drag s9 120 screen pixels to the left (it is at the right edge of the view): the document gets the new position (snapped to the grid) on release
  const zoom = await page.locator('.react-flow__viewport').evaluate((el) => new DOMMatrixReadOnly(getComputedStyle(el).transform).a);
  expect(zoom).toBeLessThan(0.45);
  await page.mouse.move(s9.x, s9.y);
  await page.mouse.down();
  for (let k = 1; k <= 6; k++) await page.mouse.move(s9.x - 20 * k, s9.y);
  await page.mouse.up();
  const want = 8100 - 120 / zoom;
  let movedX = 8100;
  await expect.poll(async () => {
    const file = (await (await page.request.get(`/api/boards/${id}/export`)).json()) as { parts: { id: string; x: number }[] };
    movedX = file.parts.find((p) => p.id === 's9')!.x;
    return movedX;
  }, { timeout: 10_000 }).toBeLessThan(want + 40);
  await expect(said).toHaveText('1 part selected: S9');
  // the view did not pan while dragging the part
  const after = await page.locator('.react-flow__viewport').evaluate((el) => getComputedStyle(el).transform);
  expect(after).toContain(`${zoom}`);

  // zoom in on the dragged part: full parts again (React Flow nodes), still selected
  const moved = await screenAt(page, movedX + 40, 30);
  await page.mouse.move(moved.x, moved.y);
  for (let k = 0; k < 12 && (await far.count()) > 0; k++) {
    await page.mouse.wheel(0, -400);
    await page.waitForTimeout(150);
  }
  await expect(far).toHaveCount(0);
  await expect(page.getByTestId('part-s9')).toHaveClass(/gf-selected/);
  await expect(page.locator('.react-flow__node[data-id="s9"]')).toHaveCount(1);
});

/** 320 parts (160 switch → lamp pairs, 16 to a row) packed so that fit-to-view lands between 0.2 and DETAIL_ZOOM. */
function largeBoard() {
  const parts: object[] = [];
  const wires: object[] = [];
  for (let i = 0; i < 160; i++) {
    const x = (i % 16) * 220;
    const y = Math.floor(i / 16) * 120;
    parts.push({ id: `s${i}`, kind: 'switch', label: `S${i}`, x, y, on: false });
    parts.push({ id: `l${i}`, kind: 'lamp', label: `L${i}`, x: x + 120, y: y + 10 });
    wires.push({ id: `w${i}`, from: `s${i}.out`, to: `l${i}.in` });
  }
  return { format: 'gatefold-board', version: 1, title: 'Packed bench board', family: 'ideal', parts, wires };
}

async function importBoard(page: Page, baseURL: string, name: string, buffer: Buffer): Promise<number> {
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: baseURL },
    multipart: { file: { name, mimeType: 'application/json', buffer } },
  });
  expect(imported.status()).toBe(201);
  return ((await imported.json()) as { board: { id: number } }).board.id;
}

const viewZoom = (page: Page) => page.locator('.react-flow__viewport').evaluate((el) => new DOMMatrixReadOnly(getComputedStyle(el).transform).a);

test('a small board fitted below the detail zoom is drawn in full: the 1-bit processor demo', async ({ page, baseURL }) => {
  await page.setViewportSize({ width: 1280, height: 720 });
  await signUp(page, OWNER);
  const file = readFileSync(new URL('../../examples/one-bit-processor.gatefold.json', import.meta.url));
  const count = (JSON.parse(file.toString()) as { parts: unknown[] }).parts.length;
  const id = await importBoard(page, baseURL!, 'one-bit-processor.gatefold.json', file);
  await page.goto(`/boards/${id}`);
  await expect(page.getByTestId('sync-note')).toHaveCount(0, { timeout: 15_000 });
  // every top-level part a full React Flow node with its symbol, no plain boxes
  await expect(page.locator('.react-flow__node')).toHaveCount(count);
  await expect(page.locator('.react-flow__node .gf-symbol').first()).toBeVisible();
  await expect(page.getByTestId('far-canvas')).toHaveCount(0);
  // fitted below DETAIL_ZOOM = 0.45 (about 0.24 on this canvas), where boxes used to be drawn; above the illegible zoom 0.2
  const zoom = await viewZoom(page);
  expect(zoom).toBeLessThan(0.45);
  expect(zoom).toBeGreaterThanOrEqual(0.2);
  // the minimap draws every part
  await expect(page.getByTestId('parts-map-boxes').locator('rect')).toHaveCount(count);
});

test('a large board zoomed out: Shift-drag selects the boxes inside the rectangle (even when it starts on a box), the minimap shows the parts', async ({ page, baseURL }) => {
  test.setTimeout(90_000);
  await page.setViewportSize({ width: 1600, height: 1000 });
  await signUp(page, OWNER);
  const id = await importBoard(page, baseURL!, 'packed.gatefold.json', Buffer.from(JSON.stringify(largeBoard())));
  await page.goto(`/boards/${id}`);
  await expect(page.getByTestId('sync-note')).toHaveCount(0, { timeout: 15_000 });

  // more than 300 parts and fitted between 0.2 and 0.45: plain boxes
  const far = page.getByTestId('far-canvas');
  await expect(far).toHaveAttribute('data-parts', '320');
  await expect(page.locator('.react-flow__node')).toHaveCount(0);
  const zoom = await viewZoom(page);
  expect(zoom).toBeGreaterThanOrEqual(0.2);
  expect(zoom).toBeLessThan(0.45);
  // the minimap (on up to 400 parts) draws all of them, though React Flow holds them as hidden nodes
  await expect(page.getByTestId('parts-map-boxes').locator('rect')).toHaveCount(320);

  // Shift-drag that starts ON a box (s17, flow 220–300 × 120–180, at its middle) up and left to flow (-20, -20):
  // a rectangle, not a press on s17; s0 (0–80 × 0–60) and l0 (120–180 × 10–50) lie wholly inside, s17 and
  // the second row's s16 and l16 (down to y 170) do not
  const from = await screenAt(page, 260, 150);
  const to = await screenAt(page, -20, -20);
  await page.keyboard.down('Shift');
  await page.mouse.move(from.x, from.y);
  await page.mouse.down();
  for (let k = 1; k <= 8; k++) await page.mouse.move(from.x + ((to.x - from.x) * k) / 8, from.y + ((to.y - from.y) * k) / 8);
  await page.mouse.up();
  await page.keyboard.up('Shift');
  await expect(page.getByTestId('far-selection')).toHaveText('2 parts selected: S0, L0');

  // the selection is the canvas's own: Delete removes those two parts from the document
  await page.keyboard.press('Delete');
  await expect.poll(async () => {
    const file = (await (await page.request.get(`/api/boards/${id}/export`)).json()) as { parts: { id: string }[] };
    return file.parts.length;
  }, { timeout: 10_000 }).toBe(318);
  await expect(far).toHaveAttribute('data-parts', '318');

  // a switch box is 80 × 60: its label needs a 24-unit font, 9 px on screen from zoom 0.375; below that no title
  // (a lamp, 60 × 40, would need 0.56: past the detail zoom, so a lamp's box never holds its label)
  if (zoom < 0.375) await expect(far).toHaveAttribute('data-titles', '0');
  // zoom in by small wheel steps (about 7 % each) to just past 0.375, still below the detail zoom: each box shows its label
  const canvas = (await page.getByTestId('board-canvas').boundingBox())!;
  await page.mouse.move(canvas.x + canvas.width / 2, canvas.y + canvas.height / 2);
  for (let k = 0; k < 20 && (await viewZoom(page)) < 0.38; k++) {
    await page.mouse.wheel(0, -50);
    await page.waitForTimeout(100);
  }
  expect(await viewZoom(page)).toBeLessThan(0.45);
  // the 159 switches left have their label in their box (the lamps none); the whole board is on the canvas
  await expect(far).toHaveAttribute('data-titles', '159');
});
