import { readFileSync } from 'node:fs';
import sharp from 'sharp';
import { expect, signUp, test } from './fixtures';

// A builder brings up the demo logic unit (examples/mux-logic-unit.gatefold.json) in a real browser
// against the real server: prints the bring-up sheet (print media), enters one wrong lamp, and the
// suspect gate is outlined on the canvas; a photo of the build goes beside the sheet. The sheet's
// expected lamps are the board's own truth table (checked against shared/bringup's tests; no outside
// source here).
const BUILDER = { name: 'Mara Quinn', email: 'mara.bringup@larkspur.example', password: 'gatefold-demo-long' };

test('bring-up: printed sheet, one wrong lamp, the suspect highlighted, a build photo', async ({ page, gatefold }) => {
  await page.setViewportSize({ width: 1500, height: 1000 });
  await signUp(page, BUILDER);
  const file = readFileSync(new URL('../../examples/mux-logic-unit.gatefold.json', import.meta.url));
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: gatefold.baseURL },
    multipart: { file: { name: 'mux-logic-unit.gatefold.json', mimeType: 'application/json', buffer: file } },
  });
  expect(imported.status()).toBe(201);
  const { board } = (await imported.json()) as { board: { id: number } };
  await page.goto(`/boards/${board.id}`);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });

  const panel = page.getByTestId('bringup-panel');
  // The vectors (a fault simulation of the board, in a worker) wait until someone looks at the panel: it
  // sits below the bench, analysis and build panels, out of view.
  await expect(page.getByTestId('bench-panel')).toBeVisible();
  const below = await panel.evaluate((el) => el.getBoundingClientRect().top - el.closest('[data-testid="side-panels"]')!.getBoundingClientRect().bottom);
  expect(below, 'the bring-up panel starts out of view').toBeGreaterThan(300);
  await page.waitForTimeout(1000);
  await expect(panel.getByTestId('bringup-vectors')).toHaveCount(0);
  await expect(panel).toHaveAttribute('aria-busy', 'false');
  await panel.scrollIntoViewIfNeeded();
  await expect(panel.getByTestId('bringup-summary')).toContainText('detect 46 of 46');
  await expect(panel).toHaveAttribute('aria-busy', 'false');
  await expect(panel.getByTestId('bringup-working')).toHaveCount(0);
  const rows = panel.getByTestId('bringup-vectors').locator('tbody tr');
  const count = await rows.count();
  expect(count).toBeGreaterThan(3);

  // the print view shows only the sheet: one row per vector, with the tube caution
  await page.emulateMedia({ media: 'print' });
  const sheet = page.getByTestId('bringup-sheet');
  await expect(sheet).toBeVisible();
  await expect(sheet.locator('tbody tr')).toHaveCount(count);
  await expect(sheet).toContainText('local electrical codes');
  await expect(page.getByTestId('board-page')).toBeHidden();
  await page.screenshot({ path: 'test-results/bringup-sheet-print.png', fullPage: true });
  await page.emulateMedia({ media: 'screen' });
  await expect(sheet).toBeHidden();

  // one wrong lamp on the first vector, recorded
  const first = panel.getByTestId('bringup-row-0');
  await first.locator('[data-testid^="bringup-lamp-0-"]').first().click();
  await first.getByTestId('bringup-record-0').click();
  const suspects = panel.getByTestId('bringup-suspects');
  await expect(suspects).toBeVisible({ timeout: 15_000 });
  const top = (await suspects.locator('li').first().locator('span.font-mono').textContent())!;
  const part = top.replace(/^swap /, '').split('.')[0];
  await expect(page.locator(`.react-flow__node[data-id="${part}"] .gf-highlight, .react-flow__node[data-id="${part}"].gf-highlight`).first()).toBeVisible();
  await expect(panel.getByTestId('bringup-next')).toContainText('Try next');

  // a photo of the build beside the sheet
  const png = await sharp({ create: { width: 400, height: 300, channels: 3, background: { r: 40, g: 60, b: 90 } } }).png().toBuffer();
  await panel.getByTestId('photo-input').setInputFiles({ name: 'rack.png', mimeType: 'image/png', buffer: png });
  await expect(panel.getByTestId('bringup-photos').locator('img')).toHaveCount(1, { timeout: 15_000 });
  await suspects.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-results/bringup-suspect.png' });
});
