import { readFileSync } from 'node:fs';
import type { Browser, Page } from '@playwright/test';
import { expect, signUp, test } from './fixtures';

// Snapshots end to end in real browsers against the real server, database and websocket: the owner
// takes a snapshot, changes the board, previews and compares the snapshot (a screenshot shows the
// compare marks) and restores it while an editor's window updates live; a viewer makes a copy and owns it.

const OWNER = { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'filament-warm-42' };
const EDITOR = { name: 'Ines Okafor', email: 'ines@larkspur.example', password: 'slate-cool-0917' };
const VIEWER = { name: 'Sam Ortiz', email: 'sam@room14.example', password: 'room-fourteen-77' };
const HALF_ADDER = readFileSync(new URL('../../examples/half-adder.gatefold.json', import.meta.url));

async function person(browser: Browser, baseURL: string, who: typeof OWNER): Promise<Page> {
  const ctx = await browser.newContext({ baseURL, viewport: { width: 1500, height: 950 } });
  const page = await ctx.newPage();
  await signUp(page, who);
  return page;
}

async function openBoard(page: Page, id: number): Promise<void> {
  await page.goto(`/boards/${id}`);
  await expect(page.getByTestId('connection-status')).toHaveAttribute('data-status', 'live');
  await expect(page.getByTestId('sync-note')).toHaveCount(0);
}

test('the owner previews, compares and restores a snapshot while another window follows; a viewer copies the board', async ({ page, browser, gatefold }) => {
  await page.setViewportSize({ width: 1500, height: 950 });
  await signUp(page, OWNER);
  const headers = { Origin: gatefold.baseURL };
  const imported = await page.request.post('/api/boards/import', {
    headers, multipart: { file: { name: 'half-adder.gatefold.json', mimeType: 'application/json', buffer: HALF_ADDER } },
  });
  expect(imported.status()).toBe(201);
  const { board } = (await imported.json()) as { board: { id: number; title: string } };
  const editor = await person(browser, gatefold.baseURL, EDITOR);
  const viewer = await person(browser, gatefold.baseURL, VIEWER);
  for (const [who, role] of [[EDITOR, 'editor'], [VIEWER, 'viewer']] as const) {
    expect((await page.request.post(`/api/boards/${board.id}/members`, { headers, data: { email: who.email, role } })).ok()).toBe(true);
  }
  await openBoard(page, board.id);
  await openBoard(editor, board.id);

  // a named snapshot of the working half adder
  await page.getByTestId('snapshot-name-input').fill('Both bits wired');
  await page.getByTestId('take-snapshot').click();
  const row = page.getByTestId('snapshot-row').filter({ hasText: 'Both bits wired' });
  await expect(row).toHaveCount(1);
  const sid = Number((await page.locator('[data-testid^="preview-"]').first().getAttribute('data-testid'))!.slice('preview-'.length));

  // the owner deletes the carry gate; the editor's window follows
  await page.getByTestId('part-g2').click();
  await page.getByTestId('tool-delete').click();
  await expect(page.getByTestId('part-g2')).toHaveCount(0);
  await expect(editor.getByTestId('part-g2')).toHaveCount(0);

  // preview: the snapshot read-only on the canvas, clearly marked; one click back to live
  await page.getByTestId(`preview-${sid}`).click();
  await expect(page.getByTestId('snapshot-banner')).toHaveAttribute('data-mode', 'preview');
  await expect(page.getByTestId('part-g2')).toHaveCount(1);
  await expect(page.getByTestId('board-canvas')).toHaveAttribute('data-readonly', 'true');
  await page.screenshot({ path: 'test-results/snapshots-01-preview.png' });
  await page.getByTestId('back-to-live').click();
  await expect(page.getByTestId('snapshot-banner')).toHaveCount(0);
  await expect(page.getByTestId('part-g2')).toHaveCount(0);

  // compare: the list and the marks on the canvas
  await page.getByTestId(`compare-${sid}`).click();
  await expect(page.getByTestId('snapshot-banner')).toHaveAttribute('data-mode', 'compare');
  await expect(page.getByTestId('compare-list')).toContainText('removed and');
  await expect(page.getByTestId('compare-list')).toContainText('removed wire g2.out → c.in');
  await expect(page.getByTestId('part-g2')).toHaveClass(/gf-mark-removed/);
  await page.screenshot({ path: 'test-results/snapshots-02-compare.png' });

  // restore (confirmed) from the banner: the editor's window gets the carry gate back, with a notice
  await page.getByTestId('banner-restore').click();
  await page.getByRole('dialog').getByRole('button', { name: 'Restore' }).click();
  await expect(page.getByTestId('snapshot-banner')).toHaveCount(0);
  await expect(editor.getByTestId('part-g2')).toHaveCount(1);
  await expect(page.getByTestId('part-g2')).toHaveCount(1);
  await expect(editor.getByText('Mara Quinn restored the snapshot “Both bits wired”')).toBeVisible();
  await expect(page.getByTestId('snapshot-row').filter({ hasText: 'Before restoring' })).toHaveCount(1);
  await editor.screenshot({ path: 'test-results/snapshots-03-editor-after-restore.png' });

  // a viewer makes their own copy and owns it
  await openBoard(viewer, board.id);
  await expect(viewer.getByTestId('take-snapshot')).toHaveCount(0);
  await viewer.getByTestId('make-copy').click();
  await expect(viewer).not.toHaveURL(new RegExp(`/boards/${board.id}$`));
  await expect(viewer.getByTestId('board-page')).toContainText('Half adder (copy)');
  await expect(viewer.getByTestId('snapshot-row')).toHaveAttribute('data-kind', 'copied-from');
  await expect(viewer.getByTestId('take-snapshot')).toBeVisible();
  const copyId = Number(new URL(viewer.url()).pathname.split('/').pop());
  const copied = await viewer.request.get(`/api/boards/${copyId}`);
  expect(((await copied.json()) as { board: { role: string } }).board.role).toBe('owner');
});
