/**
 * Modules on the canvas: two gates of an imported board become a module (the selection is replaced by
 * an instance box with the module's title and pins), the board still works through it, and double-click
 * opens its inside (its gates and ports, a breadcrumb, ports in the tray only there).
 */
import type { BoardFile } from '../../shared/board';
import { test, expect, signUp } from './fixtures';

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };

// Room 14's door interlock: the lamp lights when both the key switch and the latch switch are on.
// AND made of NAND then NOT: out = NOT(NAND(A, B)) = A·B (common practice, no source).
const INTERLOCK: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Room 14 door interlock', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'KEY', on: true, x: 0, y: 0 },
    { id: 'b', kind: 'switch', label: 'LATCH', on: false, x: 0, y: 100 },
    { id: 'g1', kind: 'nand', inputs: 2, x: 160, y: 40 },
    { id: 'g2', kind: 'not', x: 320, y: 40 },
    { id: 'l1', kind: 'lamp', label: 'OPEN', x: 480, y: 40 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'g1.in0' },
    { id: 'w2', from: 'b.out', to: 'g1.in1' },
    { id: 'w3', from: 'g1.out', to: 'g2.in0' },
    { id: 'w4', from: 'g2.out', to: 'l1.in' },
  ],
};

test('make a module from two gates, see its instance working, open it', async ({ page }) => {
  test.setTimeout(90_000);
  await page.setViewportSize({ width: 1400, height: 860 });
  await signUp(page, OWNER);
  await page.getByTestId('import-board-input').setInputFiles({ name: 'interlock.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(INTERLOCK)) });
  await expect(page).toHaveURL(/\/boards\/\d+$/);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  for (const id of ['a', 'b', 'g1', 'g2', 'l1']) await expect(page.getByTestId(`part-${id}`)).toBeVisible();
  const lamp = page.getByTestId('part-l1').locator('.gf-bulb');
  await expect(lamp).toHaveAttribute('data-lit', 'false');
  // no ports on the top level
  await expect(page.getByTestId('tray-port-in')).toHaveCount(0);

  // Select the two gates and make a module of them.
  await page.getByTestId('part-g1').click({ position: { x: 50, y: 30 } });
  await page.getByTestId('part-g2').click({ position: { x: 50, y: 20 }, modifiers: ['Control'] });
  await page.getByTestId('tool-make-module').click();
  await expect(page.getByTestId('part-g1')).toHaveCount(0);
  await expect(page.getByTestId('part-g2')).toHaveCount(0);
  const instance = page.locator('.gf-part[data-kind="module"]');
  await expect(instance).toHaveCount(1);
  await expect(instance.getByTestId('instance-title')).toHaveText('Module 1');
  // two inputs (the switches' nets) and one output (the lamp's), each wired
  await expect(instance.locator('.gf-pin-in')).toHaveCount(2);
  await expect(instance.locator('.gf-pin-out')).toHaveCount(1);
  await expect(page.locator('.react-flow__edge')).toHaveCount(3);

  // The board still works through the module: both switches on light the lamp.
  await page.getByTestId('actuator-b').click();
  await expect(lamp).toHaveAttribute('data-lit', 'true');
  await page.screenshot({ path: 'test-results/modules-01-instance.png' });

  // Double-click opens the module: its gates and ports, a breadcrumb, ports in the tray.
  await instance.dblclick({ position: { x: 70, y: 14 } });
  await expect(page.getByTestId('module-breadcrumb')).toBeVisible();
  await expect(page.getByTestId('breadcrumb-current')).toHaveText('Module 1');
  await expect(page.locator('.gf-part[data-kind="nand"]')).toHaveCount(1);
  await expect(page.locator('.gf-part[data-kind="not"]')).toHaveCount(1);
  await expect(page.locator('.gf-part[data-kind="port"]')).toHaveCount(3);
  await expect(page.locator('.gf-part[data-kind="switch"]')).toHaveCount(0);
  await expect(page.getByTestId('tray-port-in')).toBeVisible();
  await expect(page.getByTestId('tray-switch')).toHaveCount(0);

  await page.screenshot({ path: 'test-results/modules-02-inside.png' });
});
