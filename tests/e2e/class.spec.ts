import type { Page } from '@playwright/test';
import { debouncedDffBoard } from '../../shared/sim/live/fixtures/debounced-dff';
import { expect, signUp, test } from './fixtures';

// Class mode in real browsers: the owner makes a share link on the Class panel (text and QR code); a
// guest with no account opens the link text, gives a name and watches the board read-only; the guest's
// switch flip is a private try-out that changes only the guest's lamps.

const OWNER = { name: 'Ruth Calder', email: 'calder@room14.example', password: 'filament-warm-42' };
const level = (page: Page, row: string) => page.getByTestId(row).locator('[data-level]').first();

test('a guest joins from the share link text and tries inputs privately', async ({ page, browser, gatefold }) => {
  await page.setViewportSize({ width: 1500, height: 950 });
  await signUp(page, OWNER);
  const file = JSON.stringify(debouncedDffBoard('Room 14 step clock'));
  const imported = await page.request.post('/api/boards/import', {
    headers: { Origin: gatefold.baseURL },
    multipart: { file: { name: 'step-clock.gatefold.json', mimeType: 'application/json', buffer: Buffer.from(file) } },
  });
  expect(imported.status()).toBe(201);
  const { board } = (await imported.json()) as { board: { id: number } };
  await page.goto(`/boards/${board.id}`);
  const panel = page.getByTestId('class-panel');
  await panel.scrollIntoViewIfNeeded();
  await panel.getByRole('button', { name: 'New share link' }).click();
  const url = await panel.getByTestId('share-url').inputValue();
  expect(url).toMatch(/\/s\/[A-Za-z0-9_-]{22,}$/);
  await expect(panel.getByTestId('share-qr')).toBeVisible();
  await panel.screenshot({ path: 'test-results/class-01-share-link.png' });

  const other = await browser.newContext({ viewport: { width: 1500, height: 950 } });
  const guest = await other.newPage();
  await guest.goto(url);
  await guest.getByLabel('Your name').fill('Priya');
  await guest.getByRole('button', { name: 'Join as guest' }).click();
  await expect(guest.getByTestId('guest-board')).toBeVisible();
  await expect(guest.getByTestId('bench-panel')).toBeVisible();
  await expect(panel.getByTestId('audience-count')).toHaveText('1 viewer watching');

  // the guest flips D: a try-out, only on the guest's screen
  await expect(level(guest, 'bench-input-D')).toHaveAttribute('data-level', /^[01]$/);
  const before = await level(page, 'bench-input-D').getAttribute('data-level');
  await expect(level(guest, 'bench-input-D')).toHaveAttribute('data-level', before!);
  await guest.getByTestId('actuator-sw_d').click();
  await expect(guest.getByTestId('try-out-chip')).toBeVisible();
  await expect(level(guest, 'bench-input-D')).toHaveAttribute('data-level', before === '1' ? '0' : '1');
  await guest.screenshot({ path: 'test-results/class-02-guest-try-out.png' });
  await page.waitForTimeout(500);
  await expect(level(page, 'bench-input-D')).toHaveAttribute('data-level', before!);
  await expect(page.getByTestId('try-out-chip')).toHaveCount(0);
  await other.close();
});
