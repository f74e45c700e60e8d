/**
 * Modules on the canvas: two gates of an imported board become a module (the selection is replaced by
 * an instance box with the module's title and pins), the board still works through it, and double-click
 * opens its inside (its gates and ports, a breadcrumb, ports in the tray only there). Inside it a gate
 * and a port are placed from the tray and wired; back on the board the instance has the new pin and
 * drives a lamp through it, and a second screen on the same board sees each step live.
 */
import type { Locator, Page } from '@playwright/test';
import type { BoardFile } from '../../shared/board';
import { test, expect, signUp } from './fixtures';

/** Clicks the empty canvas at (fx, fy) as fractions of its box. */
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

const part = (page: Page, kind: string) => page.locator(`.gf-part[data-kind="${kind}"]`);
const pin = (node: Locator, name: string) => node.locator(`[data-handleid="${name}"]`);

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

test('make a module from two gates, see its instance working, open it, add to its inside from the tray', async ({ page, browser, gatefold }) => {
  test.setTimeout(150_000);
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


  // A second screen of the same person on the same board, staying on the top level.
  const other = await browser.newContext({ baseURL: gatefold.baseURL, storageState: await page.context().storageState() });
  const p2 = await other.newPage();
  await p2.setViewportSize({ width: 1400, height: 860 });
  await p2.goto(page.url());
  await expect(p2.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  const instance2 = part(p2, 'module');
  await expect(instance2.locator('.gf-pin-out')).toHaveCount(1);

  // Inside the module: an OR gate of the two inputs from the tray (click, then click the canvas) and a
  // new output port, wired; the OR is placed and wired inside the module, not on the board.
  await page.getByTestId('tray-or').click();
  await clickCanvas(page, 0.45, 0.8);
  await expect(part(page, 'or')).toHaveCount(1);
  await page.getByTestId('tray-port-out').click();
  await clickCanvas(page, 0.75, 0.8);
  const ports = part(page, 'port');
  await expect(ports).toHaveCount(4);
  const orGate = part(page, 'or');
  const newPort = ports.filter({ hasText: 'out1' });
  await wire(page, pin(ports.filter({ hasText: 'KEY' }), 'out'), pin(orGate, 'in0'));
  await wire(page, pin(ports.filter({ hasText: 'LATCH' }), 'out'), pin(orGate, 'in1'));
  await wire(page, pin(orGate, 'out'), pin(newPort, 'in'));
  await expect(page.locator('.react-flow__edge')).toHaveCount(7);
  await page.screenshot({ path: 'test-results/modules-03-inside-edited.png' });
  // the other screen's instance already has the new output pin, and its board has no OR of its own
  await expect(instance2.locator('.gf-pin-out')).toHaveCount(2);
  await expect(pin(instance2, 'out1')).toHaveCount(1);
  await expect(part(p2, 'or')).toHaveCount(0);

  // Back out through the breadcrumb: the instance shows the new pin; a lamp on it follows KEY OR LATCH.
  await page.getByTestId('breadcrumb-board').click();
  await expect(page.getByTestId('module-breadcrumb')).toHaveCount(0);
  await expect(part(page, 'or')).toHaveCount(0);
  await expect(instance.locator('.gf-pin-out')).toHaveCount(2);
  await page.getByTestId('tray-lamp').click();
  await clickCanvas(page, 0.6, 0.85);
  const lamps = part(page, 'lamp');
  await expect(lamps).toHaveCount(2);
  const newLamp = page.locator('.gf-part[data-kind="lamp"]:not([data-testid="part-l1"])');
  await wire(page, pin(instance, 'out1'), pin(newLamp, 'in'));
  await expect(page.locator('.react-flow__edge')).toHaveCount(4);
  const newBulb = newLamp.locator('.gf-bulb');
  // KEY and LATCH are both on: both lamps lit; LATCH off: only the OR lamp; KEY off too: neither.
  await expect(newBulb).toHaveAttribute('data-lit', 'true');
  await page.getByTestId('actuator-b').click();
  await expect(lamp).toHaveAttribute('data-lit', 'false');
  await expect(newBulb).toHaveAttribute('data-lit', 'true');
  await page.getByTestId('actuator-a').click();
  await expect(newBulb).toHaveAttribute('data-lit', 'false');
  // the other screen shows the same lamp, wired and dark, live
  const newLampId = (await newLamp.getAttribute('data-testid'))!;
  await expect(p2.getByTestId(newLampId).locator('.gf-bulb')).toHaveAttribute('data-lit', 'false');
  await expect(p2.locator('.react-flow__edge')).toHaveCount(4);
  await page.getByTestId('actuator-b').click();
  await expect(p2.getByTestId(newLampId).locator('.gf-bulb')).toHaveAttribute('data-lit', 'true');
  await page.screenshot({ path: 'test-results/modules-04-new-pin.png' });
  await other.close();
});
