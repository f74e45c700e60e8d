import { readFileSync } from 'node:fs';
import type { Page } from '@playwright/test';
import { debouncedDffBoard } from '../../shared/sim/live/fixtures/debounced-dff';
import { AXIS_H, LABEL_W, ROW_H, WAVE_COLOURS } from '../../src/features/timing/draw-waveforms';
import { expect, signUp, test } from './fixtures';

// The live simulation end to end, in real browsers against the real server, database and websocket:
// a D flip-flop of six NAND gates clocked by a bouncy push button through a gate debouncer. The owner
// presses the button on the canvas; the lamp changes on both screens and the timing strip shows one clean
// clock edge. A viewer's switch flip is a private try-out: the owner's lamps stay as they were.

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };
const VIEWER = { name: 'Theo Brandt', email: 'theo@room14.example', password: 'slate-cool-0917' };

const level = (page: Page, row: string) => page.getByTestId(row).locator('[data-level]').first();
/** The lamp as the canvas draws it (lit or not). */
const bulb = (page: Page, partId: string) => page.locator(`.react-flow__node[data-id="${partId}"] .gf-bulb`);
const rises = (page: Page, signal: string) => page.locator(`[data-testid="timing-summary"][data-signal="${signal}"]`);

test('a button press clocks the gate flip-flop on every screen; a viewer try-out stays private', async ({ page, browser, gatefold }) => {
  await page.setViewportSize({ width: 1500, height: 950 });
  await signUp(page, OWNER);
  const file = JSON.stringify(debouncedDffBoard('Larkspur debounced step clock'));
  // the server accepts writes only from its own origin, as a browser sends it
  const origin = { Origin: gatefold.baseURL };
  const imported = await page.request.post('/api/boards/import', {
    headers: origin,
    multipart: { file: { name: 'step-clock.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(file) } },
  });
  expect(imported.status()).toBe(201);
  const { board } = (await imported.json()) as { board: { id: number } };

  const other = await browser.newContext({ baseURL: gatefold.baseURL, viewport: { width: 1500, height: 950 } });
  const viewer = await other.newPage();
  await signUp(viewer, VIEWER);
  const added = await page.request.post(`/api/boards/${board.id}/members`, { headers: origin, data: { email: VIEWER.email, role: 'viewer' } });
  expect(added.ok()).toBe(true);

  await page.goto(`/boards/${board.id}`);
  await viewer.goto(`/boards/${board.id}`);
  await expect(page.getByTestId('bench-panel')).toBeVisible();
  await expect(viewer.getByTestId('read-only-note')).toBeVisible();
  // power-on: the output latch of a flip-flop built of gates picks a level, Q low (decision 002)
  for (const p of [page, viewer]) {
    await expect(level(p, 'bench-output-Q')).toHaveAttribute('data-level', '0');
    await expect(level(p, 'bench-output-CLK')).toHaveAttribute('data-level', '0');
    await expect(level(p, 'bench-input-D')).toHaveAttribute('data-level', '1');
  }
  await expect(page.getByTestId('settle-status')).toContainText('Settled');
  await expect(bulb(page, 'lamp_q')).toHaveAttribute('data-lit', 'false');
  await page.screenshot({ path: 'test-results/simulation-01-power-on.png' });

  // The owner holds the push button on the canvas for a moment, then lets go.
  const actuator = page.getByTestId('actuator-btn');
  await actuator.scrollIntoViewIfNeeded();
  await actuator.hover();
  await page.mouse.down();
  await expect(level(page, 'bench-input-STEP')).toHaveAttribute('data-level', '1');
  await expect(level(page, 'bench-output-Q')).toHaveAttribute('data-level', '1');
  await expect(bulb(page, 'lamp_q')).toHaveAttribute('data-lit', 'true');
  await page.screenshot({ path: 'test-results/simulation-02-pressed.png' });
  await page.waitForTimeout(300);
  await page.mouse.up();
  await expect(level(page, 'bench-input-STEP')).toHaveAttribute('data-level', '0');
  await expect(level(page, 'bench-output-Q')).toHaveAttribute('data-level', '1');
  await expect(level(page, 'bench-output-CHG')).toHaveAttribute('data-level', '0');

  // The timing strip: the raw button bounced, the debounced clock rose exactly once.
  await expect(rises(page, 'CLK')).toHaveAttribute('data-rises', '1');
  expect(Number(await rises(page, 'STEP').getAttribute('data-rises'))).toBeGreaterThan(1);
  await expect(rises(page, 'Q')).toHaveAttribute('data-rises', '1'); // from its power-on 0
  const strip = page.getByTestId('timing-canvas');
  const box = (await strip.boundingBox())!;
  await page.mouse.move(box.x + box.width - 4, box.y + box.height / 2);
  await expect(page.getByTestId('timing-readout')).toContainText('Q = 1');
  await expect(page.getByTestId('timing-readout')).toContainText('CLK = 0');
  await page.screenshot({ path: 'test-results/simulation-03-released-timing.png' });
  // the wheel zooms the strip (and stops it following the newest time) without scrolling the page
  const follow = page.getByTestId('timing-strip').getByLabel('Follow');
  await expect(follow).toBeChecked();
  await page.mouse.wheel(0, -200);
  await expect(follow).not.toBeChecked();
  await page.getByTestId('timing-strip').getByRole('button', { name: 'Fit' }).click();
  // any other net can be recorded too: here the flip-flop's inner gate G2
  await page.getByTestId('timing-strip').getByRole('button', { name: /^Signals \(/ }).click();
  await page.getByLabel('Filter signals').fill('g2');
  await page.getByRole('checkbox', { name: 'g2_out' }).check();
  await expect(rises(page, 'g2_out')).toHaveCount(1);
  await expect(rises(page, 'CLK')).toHaveAttribute('data-rises', '1'); // the rows already there keep their history
  await page.screenshot({ path: 'test-results/simulation-03b-signal-picker.png' });
  await page.getByTestId('timing-strip').getByRole('button', { name: /^Signals \(/ }).click();

  // The press was a document edit: the viewer's simulation saw it too.
  await expect(level(viewer, 'bench-output-Q')).toHaveAttribute('data-level', '1');
  await expect(bulb(viewer, 'lamp_q')).toHaveAttribute('data-lit', 'true');
  await expect(rises(viewer, 'CLK')).toHaveAttribute('data-rises', '1');

  // The viewer flips D on the canvas: a private try-out.
  await viewer.getByTestId('actuator-sw_d').click();
  await expect(viewer.getByTestId('try-out-chip')).toContainText('Try-out — only you see this');
  await expect(level(viewer, 'bench-input-D')).toHaveAttribute('data-level', '0');
  await expect(level(viewer, 'bench-output-CHG')).toHaveAttribute('data-level', '1');
  await expect(bulb(viewer, 'lamp_chg')).toHaveAttribute('data-lit', 'true');
  await viewer.screenshot({ path: 'test-results/simulation-04-viewer-try-out.png' });
  await page.waitForTimeout(1000);
  await expect(level(page, 'bench-input-D')).toHaveAttribute('data-level', '1');
  await expect(level(page, 'bench-output-CHG')).toHaveAttribute('data-level', '0');
  await expect(level(page, 'bench-output-Q')).toHaveAttribute('data-level', '1');
  await expect(bulb(page, 'lamp_chg')).toHaveAttribute('data-lit', 'false');
  await expect(page.getByTestId('try-out-chip')).toHaveCount(0);
  await page.screenshot({ path: 'test-results/simulation-05-owner-unchanged.png' });

  await viewer.getByTestId('try-out-chip').getByRole('button', { name: 'Reset' }).click();
  await expect(level(viewer, 'bench-input-D')).toHaveAttribute('data-level', '1');
  await expect(level(viewer, 'bench-output-CHG')).toHaveAttribute('data-level', '0');
  await expect(viewer.getByTestId('try-out-chip')).toHaveCount(0);

  // The recording exports as a value change dump.
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export VCD' }).click()]);
  expect(download.suggestedFilename()).toBe('larkspur-debounced-step-clock.vcd');
  const vcd = readFileSync((await download.path())!, 'utf8');
  expect(vcd).toContain('$enddefinitions $end');
  expect(vcd).toMatch(/\$var wire 1 \S+ CLK \$end/);
  await other.close();
});

/** A toggle flip-flop on a clock part, an enable-gated ring of three inversions, and a fought-over net. */
function benchTroubleBoard() {
  return {
    format: 'gatefold-board', version: 1, title: 'Room 14 clock and ring', family: 'ideal',
    parts: [
      { id: 'ck', kind: 'clock', label: 'CK', period: 20, x: 40, y: 40 },
      { id: 'ff', kind: 'dff', x: 200, y: 40 },
      { id: 'q', kind: 'lamp', label: 'Q', x: 380, y: 40 },
      { id: 'en', kind: 'switch', label: 'EN', on: false, x: 40, y: 220 },
      { id: 'r1', kind: 'nand', inputs: 2, x: 200, y: 220 },
      { id: 'r2', kind: 'not', x: 320, y: 220 },
      { id: 'r3', kind: 'not', x: 440, y: 220 },
      { id: 'ring', kind: 'probe', label: 'RING', x: 560, y: 220 },
      { id: 'a', kind: 'switch', label: 'A', on: true, x: 40, y: 380 },
      { id: 'b', kind: 'switch', label: 'B', on: false, x: 40, y: 470 },
      { id: 'fight', kind: 'lamp', label: 'F', x: 260, y: 420 },
    ],
    wires: [
      { id: 'w1', from: 'ck.out', to: 'ff.clk' }, { id: 'w2', from: 'ff.qn', to: 'ff.d' }, { id: 'w3', from: 'ff.q', to: 'q.in' },
      { id: 'w4', from: 'en.out', to: 'r1.in0' }, { id: 'w5', from: 'r3.out', to: 'r1.in1' }, { id: 'w6', from: 'r1.out', to: 'r2.in0' },
      { id: 'w7', from: 'r2.out', to: 'r3.in0' }, { id: 'w8', from: 'r3.out', to: 'ring.in' },
      { id: 'w9', from: 'a.out', to: 'fight.in' }, { id: 'w10', from: 'b.out', to: 'fight.in' },
    ],
  };
}

test('the bench clock steps and runs, a ring that will not settle pulses, a tube family shows the caution', async ({ page, gatefold }) => {
  await page.setViewportSize({ width: 1500, height: 950 });
  await signUp(page, OWNER);
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: gatefold.baseURL },
    multipart: { file: { name: 'ring.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(benchTroubleBoard())) } },
  });
  expect(imported.status()).toBe(201);
  const { board } = (await imported.json()) as { board: { id: number } };
  await page.goto(`/boards/${board.id}`);
  const bench = page.getByTestId('bench-panel');
  await expect(level(page, 'bench-output-Q')).toHaveAttribute('data-level', '0');

  // two switches drive one lamp: a conflict, read as X, with its sentence on the parts' badges
  await expect(level(page, 'bench-output-F')).toHaveAttribute('data-level', 'X');
  await expect(page.getByTestId('settle-status')).toContainText('Conflicts');
  await expect(page.getByTestId('badge-a')).toHaveAttribute('title', 'Two outputs drive this net (a.out, b.out): it reads X.');

  // one step is one full cycle: a toggle flip-flop's Q after k rising edges is k mod 2 (common practice, no source)
  await bench.getByRole('button', { name: 'Step' }).click();
  await expect(page.getByTestId('bench-cycles')).toHaveText('cycle 1');
  await expect(level(page, 'bench-output-Q')).toHaveAttribute('data-level', '1');
  await bench.getByRole('button', { name: 'Step' }).click();
  await expect(page.getByTestId('bench-cycles')).toHaveText('cycle 2');
  await expect(level(page, 'bench-output-Q')).toHaveAttribute('data-level', '0');

  await bench.getByLabel('Clock rate').fill('75');
  await bench.getByRole('button', { name: 'Run' }).click();
  await expect.poll(async () => Number((await page.getByTestId('bench-cycles').textContent())?.replace('cycle ', '')), { timeout: 10_000 }).toBeGreaterThan(6);
  await bench.getByRole('button', { name: 'Pause' }).click();
  const cycles = await page.getByTestId('bench-cycles').textContent();
  await page.waitForTimeout(500);
  await expect(page.getByTestId('bench-cycles')).toHaveText(cycles!);
  const n = Number(cycles!.replace('cycle ', ''));
  await expect(level(page, 'bench-output-Q')).toHaveAttribute('data-level', n % 2 ? '1' : '0');
  await page.getByRole('button', { name: 'Clock cycles' }).click();
  await page.screenshot({ path: 'test-results/simulation-06-clock-cycles.png' });
  expect(Number(await rises(page, 'CK').getAttribute('data-rises'))).toBeGreaterThan(6);
  await page.getByTestId('timing-strip').getByRole('button', { name: 'Clear' }).click();
  await expect(rises(page, 'CK')).toHaveAttribute('data-rises', '0');

  // enabling the ring: it never settles, its wires pulse and its gates carry a badge
  await bench.getByRole('button', { name: 'Switch EN' }).click();
  await expect(page.getByTestId('settle-status')).toContainText('Oscillating');
  await expect(page.getByTestId('net-pulse-style')).toHaveCount(1);
  expect(await page.getByTestId('net-pulse-style').textContent()).toContain('[data-id="w6"]');
  const animation = (id: string) => page.locator(`.react-flow__edge[data-id="${id}"] .react-flow__edge-path`).evaluate((el) => getComputedStyle(el).animationName);
  expect(await animation('w6')).toBe('gf-net-pulse');
  expect(await animation('w1')).toBe('none'); // the clock's wire settles between edges
  await expect(page.getByTestId('badge-r2')).toHaveAttribute('title', /does not settle/);
  await page.screenshot({ path: 'test-results/simulation-07-oscillating.png' });

  // the family is a document edit; a tube family brings the safety caution
  await bench.getByLabel('Bench logic family').selectOption('tube-drl-nor');
  await expect(page.getByTestId('safety-caution')).toContainText('local electrical codes');
  await page.screenshot({ path: 'test-results/simulation-08-tube-caution.png' });

  const [png] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export PNG' }).click()]);
  expect(png.suggestedFilename()).toBe('room-14-clock-and-ring-timing.png');
  const bytes = readFileSync((await png.path())!);
  expect(bytes.subarray(1, 4).toString('latin1')).toBe('PNG');
});

test('a board with a program store inside a module: the bench lists its own inputs, the strip records what can change', async ({ page, gatefold }) => {
  await page.setViewportSize({ width: 1500, height: 950 });
  await signUp(page, OWNER);
  const file = readFileSync(new URL('../../examples/one-bit-processor.gatefold.json', import.meta.url));
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: gatefold.baseURL },
    multipart: { file: { name: 'one-bit-processor.gatefold.json', mimeType: 'application/json', buffer: file } },
  });
  expect(imported.status()).toBe(201);
  const { board } = (await imported.json()) as { board: { id: number } };
  await page.goto(`/boards/${board.id}`);
  // 171 gates in modules: on a loaded machine the first state can take a while (a wait for a state, not a speed check)
  await expect(level(page, 'bench-input-DIN')).toHaveAttribute('data-level', /^[01]$/, { timeout: 60_000 });
  // the board's own inputs: the DIN switch, the clock and its one constant; none of the 16 constants inside
  // the program store's instance (decision 004: the board's inputs and outputs are its top level)
  const inputRows = page.locator('[data-testid^="bench-input-"]');
  await expect(inputRows).toHaveCount(3);
  await expect(page.locator('[data-testid^="bench-input-rom/"]')).toHaveCount(0);
  await expect(page.getByTestId('bench-input-CLK')).toBeVisible();
  // its unlabelled constant reads by its level, not as a numbered name cut to the column; the full name on hover
  const constName = page.getByTestId('bench-input-one').locator('span[title]').first();
  await expect(constName.locator('[aria-hidden="true"]')).toHaveText('logic 1');
  await expect(constName).toHaveAttribute('title', 'Constant 1, tied to logic 1 (id one)');
  expect(await constName.evaluate((el) => el.scrollWidth <= el.clientWidth)).toBe(true);
  // the strip records by default what can change: DIN, CLK and the eleven lamps, no constant
  const rows = page.getByTestId('timing-summary');
  await expect(rows).toHaveCount(13);
  const signals = await rows.evaluateAll((els) => els.map((e) => e.getAttribute('data-signal')));
  expect(signals.slice(0, 2)).toEqual(['DIN', 'CLK']);
  expect(signals).toEqual(expect.arrayContaining(['STEP0', 'STEP1', 'OUT']));
  // Right after opening, before anything changed, each row shows its level now as a line from the start
  // of the recording (it starts after power-on, at t > 0; the strip used to draw those rows empty until the
  // first change): in every row, nearly every column of the plot holds the 0 or the 1 colour.
  const drawnShare = () => page.getByTestId('timing-canvas').evaluate((c: HTMLCanvasElement, g) => {
    const ctx = c.getContext('2d')!;
    const k = c.width / c.clientWidth;
    const rgb = (h: string) => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16));
    const bg = rgb(g.surface);
    // a level's colour over the strip's background, at least half covering the pixel (lines are antialiased)
    const colours = g.colours.map((h) => rgb(h).map((v, i) => v - bg[i]));
    const isLevel = (p: ArrayLike<number>, i: number) => colours.some((c) => {
      const d = [p[i] - bg[0], p[i + 1] - bg[1], p[i + 2] - bg[2]];
      const a = (d[0] * c[0] + d[1] * c[1] + d[2] * c[2]) / (c[0] ** 2 + c[1] ** 2 + c[2] ** 2);
      return a > 0.5 && d.every((v, j) => Math.abs(v - a * c[j]) < 12);
    });
    const shares: number[] = [];
    for (let row = 0; (g.axis + (row + 1) * g.row) * k <= c.height; row++) {
      const x0 = Math.ceil((g.label + 2) * k);
      const img = ctx.getImageData(x0, Math.floor((g.axis + row * g.row) * k), c.width - x0 - 2, Math.floor(g.row * k)).data;
      const w = c.width - x0 - 2;
      let lit = 0;
      for (let x = 0; x < w; x++) {
        let hit = false;
        for (let y = 0; y < img.length / 4 / w && !hit; y++) {
          const i = 4 * (y * w + x);
          hit = isLevel(img, i);
        }
        if (hit) lit++;
      }
      shares.push(lit / w);
    }
    return shares;
  }, { colours: [WAVE_COLOURS.high, WAVE_COLOURS.low], surface: WAVE_COLOURS.surface, axis: AXIS_H, row: ROW_H, label: LABEL_W });
  await expect.poll(async () => { const s = await drawnShare(); return s.length >= 3 && s.every((v) => v > 0.95); }).toBe(true);
  await expect(page.getByTestId('timing-strip').getByRole('button', { name: 'Signals (13)' })).toBeVisible();
  await page.screenshot({ path: 'test-results/simulation-09-program-store.png' });
  // any net can still be added with the picker: a program bit inside the store
  await page.getByTestId('timing-strip').getByRole('button', { name: 'Signals (13)' }).click();
  const picker = page.getByRole('dialog', { name: 'Signals to record' });
  await picker.getByLabel('Filter signals').fill('rom/c_s0_b3');
  await picker.getByRole('checkbox', { name: 'rom/c_s0_b3_out' }).check();
  await expect(page.locator('[data-testid="timing-summary"][data-signal="rom/c_s0_b3_out"]')).toHaveCount(1);
  await expect(rows).toHaveCount(14);
});
