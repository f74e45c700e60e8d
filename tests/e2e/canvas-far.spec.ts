import { test, expect, signUp } from './fixtures';

// Zoomed out, the canvas draws the parts itself (one drawing of plain boxes, flow/far-parts.tsx) instead
// of a React Flow node each. Selecting and dragging a part still work there, a drag reaches the document,
// and zooming in brings back the full parts with the selection kept. Demo names from our own scenario.

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };

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

  // fitted far below the detail zoom: every part a box of the far drawing, no React Flow node in the page
  await expect(page.locator('[data-far-id]')).toHaveCount(120);
  await expect(page.locator('.react-flow__node')).toHaveCount(0);
  await expect(page.getByTestId('far-wires').locator('.react-flow__edge')).toHaveCount(60);

  // a click selects the part (alone); Ctrl adds another
  const s5 = page.locator('[data-far-id="s5"]');
  await s5.click();
  await expect(s5).toHaveClass(/gf-selected/);
  await page.locator('[data-far-id="l7"]').click({ modifiers: ['Control'] });
  await expect(page.locator('[data-far-id="l7"]')).toHaveClass(/gf-selected/);
  await expect(s5).toHaveClass(/gf-selected/);
  await page.locator('[data-far-id="s9"]').click();
  await expect(page.locator('.gf-far-part.gf-selected')).toHaveCount(1);

  // drag s9 120 screen pixels to the left (it is at the right edge of the view): the document gets the new position (snapped to the grid) on release
  const zoom = await page.locator('.react-flow__viewport').evaluate((el) => new DOMMatrixReadOnly(getComputedStyle(el).transform).a);
  expect(zoom).toBeLessThan(0.45);
  const box = (await page.locator('[data-far-id="s9"] rect').boundingBox())!;
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.down();
  for (let k = 1; k <= 6; k++) await page.mouse.move(box.x + box.width / 2 - 20 * k, box.y + box.height / 2);
  await page.mouse.up();
  const want = 8100 - 120 / zoom;
  await expect.poll(async () => {
    const file = (await (await page.request.get(`/api/boards/${id}/export`)).json()) as { parts: { id: string; x: number }[] };
    return file.parts.find((p) => p.id === 's9')!.x;
  }, { timeout: 10_000 }).toBeLessThan(want + 40);
  // the view did not pan while dragging the part
  const after = await page.locator('.react-flow__viewport').evaluate((el) => getComputedStyle(el).transform);
  expect(after).toContain(`${zoom}`);

  // zoom in on the dragged part: full parts again (React Flow nodes), still selected
  const moved = (await page.locator('[data-far-id="s9"] rect').boundingBox())!;
  await page.mouse.move(moved.x + moved.width / 2, moved.y + moved.height / 2);
  for (let k = 0; k < 12 && (await page.locator('[data-far-id]').count()) > 0; k++) {
    await page.mouse.wheel(0, -400);
    await page.waitForTimeout(150);
  }
  await expect(page.locator('[data-far-id]')).toHaveCount(0);
  await expect(page.getByTestId('part-s9')).toHaveClass(/gf-selected/);
  await expect(page.locator('.react-flow__node[data-id="s9"]')).toHaveCount(1);
});
