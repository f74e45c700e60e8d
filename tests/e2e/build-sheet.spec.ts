import { readFileSync } from 'node:fs';
import { expect, signUp, test } from './fixtures';

// A tube builder plans the build of the demo logic unit (examples/tube-logic-unit.gatefold.json: eight
// NOR gates) in a real browser against the real server: picks the tube family and reads the tube count,
// the heater current (8 × 0.3 A for the 6AU6, tube data tables), the level check (the CHECKS.md input
// divider: −4.8 V with all inputs low, common practice, no source) and the safety caution; then converts
// the board to NOR-only, which makes a new board.
const BUILDER = { name: 'Mara Quinn', email: 'mara.build@larkspur.example', password: 'gatefold-demo-long' };

test('build sheet: tube family figures, level check, caution, and the NOR-only conversion', async ({ page, gatefold }) => {
  await page.setViewportSize({ width: 1500, height: 1000 });
  await signUp(page, BUILDER);
  // the board arrives as 74HC so that the builder has to pick the tube family
  const file = JSON.parse(readFileSync(new URL('../../examples/tube-logic-unit.gatefold.json', import.meta.url), 'utf8'));
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: gatefold.baseURL },
    multipart: { file: { name: 'tube-logic-unit.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify({ ...file, family: 'cmos-74hc' })) } },
  });
  expect(imported.status()).toBe(201);
  const { board } = (await imported.json()) as { board: { id: number } };
  await page.goto(`/boards/${board.id}`);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });

  const panel = page.getByTestId('build-panel');
  await panel.scrollIntoViewIfNeeded();
  await expect(panel.getByTestId('build-devices')).toContainText('packages');
  await expect(panel.getByTestId('build-safety-caution')).toHaveCount(0);

  await panel.getByTestId('build-family').selectOption('tube-drl-nor');
  await expect(panel.getByTestId('build-devices')).toHaveText('8 tubes');
  await expect(panel.getByTestId('build-heater')).toContainText('2.40 A');
  await expect(panel.getByTestId('build-parts')).toContainText('6AU6 pentode');
  await expect(panel.getByTestId('build-clock')).toBeVisible();
  await expect(panel.getByTestId('level-low')).toHaveText('−4.800 V');
  await expect(panel.getByTestId('level-verdict')).toHaveText('pass');
  await expect(panel.getByTestId('build-safety-caution')).toContainText('local electrical codes');

  // an edited resistor changes the level check at once: 220 kΩ to −12 V no longer cuts the tube off
  await panel.getByTestId('level-R2').fill('220k');
  await expect(panel.getByTestId('level-verdict')).toHaveText('warn');
  await panel.getByTestId('level-R2').fill('');
  await expect(panel.getByTestId('level-verdict')).toHaveText('pass');

  // the critical path outlined on the canvas
  await panel.getByTestId('build-show-path').check();
  await expect(page.locator('.react-flow__node[data-id="g_xor"]')).toBeVisible();
  await panel.getByTestId('level-check').scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-results/build-sheet.png' });

  await panel.getByRole('button', { name: 'Convert to NOR-only…' }).click();
  await expect(panel.getByTestId('convert-preview')).toContainText('8 NOR gates');
  await panel.getByTestId('convert-create').click();
  await expect(page).not.toHaveURL(new RegExp(`/boards/${board.id}$`), { timeout: 15_000 });
  await expect(page.getByTestId('board-page')).toBeVisible();
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  await expect(page.getByText('Tube logic unit (NOR only)').first()).toBeVisible();
});
