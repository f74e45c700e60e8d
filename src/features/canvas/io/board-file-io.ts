/**
 * Board files in and out: download the board as `<title>.gatefold.json`, and upload a file into a NEW
 * board through `POST /api/boards/import` (the server checks it and names the bad ids in its errors).
 */
import type { BoardFile } from '../../../../shared/board';
import { toHierarchicalVerilog } from '../../../../shared/sim';
import { ApiError } from '../../../lib/api-client';

/** A file name from a board title (letters, digits, dashes). */
export function boardFileName(title: string, ext = 'gatefold.json'): string {
  const stem = title.trim().toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'board';
  return `${stem}.${ext}`;
}

/** Saves a blob or data URL as a download. */
export function download(data: Blob | string, fileName: string): void {
  const url = typeof data === 'string' ? data : URL.createObjectURL(data);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  if (typeof data !== 'string') setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Downloads the board file (the same JSON as the export route: `JSON.stringify` of the board). */
export function downloadBoardFile(board: BoardFile): void {
  download(new Blob([JSON.stringify(board, null, 2) + '\n'], { type: 'application/json' }), boardFileName(board.title));
}

/**
 * Downloads the board as structural Verilog (IEEE Std 1364), `<title>.v`: the same text as the command
 * line's `export-verilog` (shared/sim toHierarchicalVerilog: one Verilog module per Gatefold module).
 */
export function downloadVerilog(board: BoardFile): void {
  const text = toHierarchicalVerilog(board);
  download(new Blob([text], { type: 'text/plain' }), boardFileName(board.title || 'board', 'v'));
}

/** The server's error for a refused import, with the problems it listed (they name the bad ids). */
function importError(status: number, body: unknown): ApiError {
  const err = (body as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null)?.error;
  const fields = err?.fields ?? {};
  const head = err?.message ?? `The server answered ${status}`;
  // the server's message may already quote a problem: each problem is said once
  const details = Object.values(fields).filter((v) => typeof v === 'string' && !head.includes(v));
  const message = [head, ...details.slice(0, 6)].join(' — ');
  return new ApiError(status, err?.code ?? `http_${status}`, message, fields);
}

/** Uploads a board file as a new board; resolves with the new board's id. */
export async function importBoardFile(file: File): Promise<{ id: number; title: string }> {
  const form = new FormData();
  form.append('file', file, file.name);
  let res: Response;
  try {
    res = await fetch('/api/boards/import', { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError(0, 'network_error', 'Could not reach the Gatefold server.');
  }
  const body: unknown = await res.json().catch(() => null);
  if (!res.ok) throw importError(res.status, body);
  const board = (body as { board?: { id: number; title: string } } | null)?.board;
  if (!board) throw new ApiError(res.status, 'bad_response', 'The server did not return the new board.');
  return board;
}
