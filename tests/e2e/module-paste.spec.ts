/**
 * What goes into an open module: a module takes its inputs through its ports, so switches, buttons and
 * clocks stay on the top level. A selection with a switch pasted inside an open module goes in without
 * the switch (and its wires), and the user is told what was left out and why; a switch still armed from
 * the top level's tray is refused the same way. The stored board agrees.
 */
import type { Page } from '@playwright/test';
import type { BoardFile } from '../../shared/board';
import { test, expect, signUp } from './fixtures';

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };

// The Larkspur hall light: a key switch and a door switch through a NAND to a lamp, and an inverter
// module used once (NOT of NAND is AND; common practice, no source).
const HALL: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Larkspur hall light', family: 'ideal',
  parts: [
    { id: 'key', kind: 'switch', label: 'KEY', on: true, x: 0, y: 0 },
    { id: 'door', kind: 'switch', label: 'DOOR', on: false, x: 0, y: 120 },
    { id: 'g1', kind: 'nand', inputs: 2, x: 180, y: 40 },
    { id: 'u1', kind: 'module', module: 'inv', x: 360, y: 40 },
    { id: 'hall', kind: 'lamp', label: 'HALL', x: 560, y: 40 },
  ],
  wires: [
    { id: 'w1', from: 'key.out', to: 'g1.in0' },
    { id: 'w2', from: 'door.out', to: 'g1.in1' },
    { id: 'w3', from: 'g1.out', to: 'u1.I' },
    { id: 'w4', from: 'u1.O', to: 'hall.in' },
  ],
  modules: [{
    id: 'inv', title: 'Inverter',
    parts: [
      { id: 'pi', kind: 'port', dir: 'in', label: 'I', x: 0, y: 40 },
      { id: 'n1', kind: 'not', x: 160, y: 40 },
      { id: 'po', kind: 'port', dir: 'out', label: 'O', x: 320, y: 40 },
    ],
    wires: [{ id: 'm1', from: 'pi.out', to: 'n1.in0' }, { id: 'm2', from: 'n1.out', to: 'po.in' }],
  }],
};

const part = (page: Page, kind: string) => page.locator(`.gf-part[data-kind="${kind}"]`);
const RULE = 'Switches, buttons and clocks stay on the top level: a module takes its inputs through ports.';

test('pasting a selection with a switch into an open module leaves the switch out and says why', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1400, height: 860 });
  await signUp(page, OWNER);
  await page.getByTestId('import-board-input').setInputFiles({ name: 'hall.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(HALL)) });
  await expect(page).toHaveURL(/\/boards\/\d+$/);
  const boardId = Number(/\/boards\/(\d+)$/.exec(page.url())![1]);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 });
  for (const id of ['key', 'door', 'g1', 'u1', 'hall']) await expect(page.getByTestId(`part-${id}`)).toBeVisible();

  // Copy the key switch, the NAND and the lamp (the wire key → NAND comes along).
  // (a click on the switch's face would flip it: take its corner)
  await page.getByTestId('part-key').click({ position: { x: 1, y: 1 } });
  await page.getByTestId('part-g1').click({ position: { x: 50, y: 30 }, modifiers: ['Control'] });
  await page.getByTestId('part-hall').click({ position: { x: 20, y: 20 }, modifiers: ['Control'] });
  await page.keyboard.press('Control+c');
  await expect(page.getByText('Copied 3 part(s)')).toBeVisible();
  // a switch armed in the tray before the module is opened
  await page.getByTestId('tray-switch').click();

  // Open the module and paste there.
  await part(page, 'module').dblclick({ position: { x: 70, y: 14 } });
  await expect(page.getByTestId('breadcrumb-current')).toHaveText('Inverter');
  await expect(part(page, 'port')).toHaveCount(2);
  const pane = (await page.locator('.react-flow__pane').boundingBox())!;
  await page.mouse.move(pane.x + pane.width * 0.3, pane.y + pane.height * 0.75);
  await page.keyboard.press('Control+v');
  const notice = page.getByText('Pasted 2 part(s). Left out 1 switch (KEY).');
  await expect(notice).toBeVisible();
  await expect(notice).toContainText(RULE);
  // the NAND and the lamp went in, the switch did not (fit the view: parts out of view are not drawn)
  await page.locator('.react-flow__controls-fitview').click();
  await page.screenshot({ path: 'test-results/module-paste-01-left-out.png' });
  await expect(part(page, 'nand')).toHaveCount(1);
  await expect(part(page, 'lamp')).toHaveCount(1);
  await expect(part(page, 'not')).toHaveCount(1);
  await expect(part(page, 'switch')).toHaveCount(0);

  // The armed switch: a click on the module's canvas is refused with the same reason.
  await page.mouse.click(pane.x + pane.width * 0.7, pane.y + pane.height * 0.85);
  const refusal = page.getByText('A switch cannot go here.');
  await expect(refusal).toBeVisible();
  await expect(refusal).toContainText(RULE);
  await expect(part(page, 'switch')).toHaveCount(0);

  // Back on the board: its own parts as they were, one NAND and one lamp only.
  await page.getByTestId('breadcrumb-board').click();
  await expect(page.getByTestId('module-breadcrumb')).toHaveCount(0);
  await expect(part(page, 'switch')).toHaveCount(2);
  await expect(part(page, 'nand')).toHaveCount(1);

  // The stored board: the module holds the pasted NAND and lamp, no switch; nothing was repaired away.
  await expect.poll(async () => {
    const res = await page.request.get(`/api/boards/${boardId}/export`);
    const file = (await res.json()) as BoardFile;
    return file.modules?.find((m) => m.id === 'inv')?.parts.map((p) => p.kind).sort();
  }).toEqual(['lamp', 'nand', 'not', 'port', 'port']);
  const file = (await (await page.request.get(`/api/boards/${boardId}/export`)).json()) as BoardFile;
  expect(file.parts.map((p) => p.id)).toEqual(HALL.parts.map((p) => p.id));
});
