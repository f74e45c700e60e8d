import { readFileSync } from 'node:fs';
import type { Page } from '@playwright/test';
import { expect, signUp, test } from './fixtures';

// Lead / follow and explain in real browsers: the owner leads on the mux logic unit demo board, a guest
// who joined by the share link follows the owner's pan and zoom (a screenshot pair), stops following by
// zooming by hand and follows again with one click; then the owner explains the settle of every input
// row step by step and the guest sees the same step, the changing part outlined on both canvases.

const OWNER = { name: 'Ruth Calder', email: 'calder@room14.example', password: 'filament-warm-42' };

/** The canvas viewport as React Flow draws it: translate(x, y) scale(zoom). */
async function viewport(page: Page): Promise<{ x: number; y: number; zoom: number }> {
  const t = await page.locator('.react-flow__viewport').first().evaluate((el) => (el as HTMLElement).style.transform);
  const m = /translate\(([-\d.e]+)px,\s*([-\d.e]+)px\)\s*scale\(([-\d.e]+)\)/.exec(t);
  if (!m) throw new Error(`unexpected viewport transform ${t}`);
  return { x: Number(m[1]), y: Number(m[2]), zoom: Number(m[3]) };
}

/** The board point in the middle of the canvas (the leader's tray makes its canvas narrower than a guest's). */
async function middle(page: Page): Promise<{ x: number; y: number; zoom: number }> {
  const v = await viewport(page);
  const box = (await page.locator('.react-flow').first().boundingBox())!;
  return { x: (box.width / 2 - v.x) / v.zoom, y: (box.height / 2 - v.y) / v.zoom, zoom: v.zoom };
}

async function sameViewport(a: Page, b: Page): Promise<void> {
  await expect.poll(async () => {
    const [ma, mb] = [await middle(a), await middle(b)];
    return Math.abs(ma.x - mb.x) < 1 && Math.abs(ma.y - mb.y) < 1 && Math.abs(ma.zoom - mb.zoom) < 0.001;
  }).toBe(true);
}

async function wheelOnPane(page: Page, dy: number): Promise<void> {
  const box = (await page.locator('.react-flow__pane').first().boundingBox())!;
  await page.mouse.move(box.x + box.width * 0.7, box.y + box.height * 0.8);
  await page.mouse.wheel(0, dy);
}

const outlined = (page: Page, part: string) =>
  page.locator(`.react-flow__node[data-id="${part}"] .gf-highlight, .react-flow__node[data-id="${part}"].gf-highlight`).first();

test('a guest follows the leader\'s view and the explanation of the mux logic unit, row by row', async ({ page, browser, gatefold }) => {
  test.setTimeout(240_000);
  await page.setViewportSize({ width: 1500, height: 950 });
  await signUp(page, OWNER);
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: gatefold.baseURL },
    multipart: { file: { name: 'mux-logic-unit.gatefold.json', mimeType: 'application/json', buffer: readFileSync('examples/mux-logic-unit.gatefold.json') } },
  });
  expect(imported.status()).toBe(201);
  const { board } = (await imported.json()) as { board: { id: number } };
  await page.goto(`/boards/${board.id}`);
  const classPanel = page.getByTestId('class-panel');
  await classPanel.scrollIntoViewIfNeeded();
  await classPanel.getByRole('button', { name: 'New share link' }).click();
  const url = await classPanel.getByTestId('share-url').inputValue();

  const other = await browser.newContext({ viewport: { width: 1500, height: 950 } });
  const guest = await other.newPage();
  await guest.goto(url);
  await guest.getByLabel('Your name').fill('Priya');
  await guest.getByRole('button', { name: 'Join as guest' }).click();
  await expect(guest.getByTestId('guest-board')).toBeVisible();
  await expect(classPanel.getByTestId('audience-count')).toHaveText('1 viewer watching');

  // the owner leads and zooms in; the guest's canvas follows
  const lesson = page.getByTestId('lesson-panel');
  await lesson.scrollIntoViewIfNeeded();
  await lesson.getByRole('button', { name: 'Start leading' }).click();
  await expect(lesson.getByTestId('follower-count')).toHaveText('1 viewer watching');
  const guestLesson = guest.getByTestId('lesson-panel');
  await guestLesson.scrollIntoViewIfNeeded();
  await expect(guestLesson.getByTestId('following')).toContainText('Following Ruth Calder');
  const guestBefore = await viewport(guest);
  await wheelOnPane(page, -400);
  await page.waitForTimeout(300);
  await wheelOnPane(page, -300);
  const leader = await viewport(page);
  expect(leader.zoom).toBeGreaterThan(guestBefore.zoom * 1.2);
  await sameViewport(page, guest);
  await page.waitForTimeout(300); // the 200 ms animation has ended
  await page.locator('.react-flow').first().screenshot({ path: 'test-results/class-follow-01-leader.png' });
  await guest.locator('.react-flow').first().screenshot({ path: 'test-results/class-follow-02-follower.png' });

  // the guest zooms by hand: no longer following; the leader pans on; Follow again catches up
  await wheelOnPane(guest, 500);
  await expect(guestLesson.getByTestId('not-following')).toBeVisible();
  const guestOwn = await viewport(guest);
  await wheelOnPane(page, 250);
  await page.waitForTimeout(600);
  expect(await viewport(guest)).toEqual(guestOwn);
  await guestLesson.getByRole('button', { name: 'Follow again' }).click();
  await sameViewport(page, guest);

  // explain, row by row: the owner steps; the guest sees the same step and reason
  await lesson.getByRole('button', { name: 'Open' }).click();
  const ownerExplain = lesson.getByTestId('explain');
  const guestExplain = guestLesson.getByTestId('explain');
  await expect(guestExplain).toBeVisible();
  const rows = await ownerExplain.getByTestId('explain-row').locator('option').count();
  expect(rows).toBe(16);
  for (let row = 0; row < rows; row++) {
    await ownerExplain.getByTestId('explain-row').selectOption(String(row));
    await expect(ownerExplain.getByTestId('explain-position')).toContainText('step 0 of');
    // inputs A, B, S0, S1 in file order, A most significant; the board's note: 00 AND, 01 OR, 10 XOR, 11 NOT A
    const [a, b, s0, s1] = [3, 2, 1, 0].map((k) => (row >> k) & 1);
    const sel = s1 * 2 + s0;
    const y = [a & b, a | b, a ^ b, 1 - a][sel];
    let lastMux = '';
    for (let k = 0; k < 40; k++) {
      const forward = ownerExplain.getByTestId('explain-forward');
      if (await forward.isDisabled()) break;
      await forward.click();
      const reason = (await ownerExplain.getByTestId('explain-reason').textContent()) ?? '';
      const position = (await ownerExplain.getByTestId('explain-position').textContent()) ?? '';
      await expect(guestExplain.getByTestId('explain-position')).toHaveText(position);
      await expect(guestExplain.getByTestId('explain-reason')).toHaveText(reason);
      if (reason.startsWith('4:1 mux mux:')) {
        lastMux = reason;
        await expect(outlined(page, 'mux')).toBeVisible();
        await expect(outlined(guest, 'mux')).toBeVisible();
        if (row === 6) {
          await page.locator('.react-flow').first().screenshot({ path: 'test-results/class-follow-03-explain-leader.png' });
          await guest.locator('.react-flow').first().screenshot({ path: 'test-results/class-follow-04-explain-follower.png' });
        }
      }
    }
    expect(lastMux, `row ${row}`).toBe(`4:1 mux mux: select S1 S0 is ${s1}${s0}, so the output passes d${sel}, which is ${y}`);
    await expect(ownerExplain.getByTestId('explain-done')).toHaveText('Settled: nothing changes any more.');
  }
  await other.close();
});
