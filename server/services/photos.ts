/**
 * Build photos of a board. An upload is checked by its content (JPEG, PNG or WebP by magic bytes, then
 * sharp must read it as that format), re-encoded without its metadata (EXIF, GPS, camera) after turning
 * it upright, and given a thumbnail. Files live under UPLOAD_DIR/photos/board-<id>/ with names we
 * choose; deleting a board deletes the folder ('board-deleted'). Only the uploader or the owner deletes.
 */
import { randomBytes } from 'node:crypto';
import { mkdir, rm, unlink, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import sharp, { type OutputInfo } from 'sharp';
import type { BoardRole } from '../../shared/api';
import type { BoardFile } from '../../shared/board';
import { deletePhoto, getPhoto, insertPhoto, listPhotos, type PhotoRow } from '../db/photos';
import { nowIso, type Db } from '../db/knex';
import { badRequest, forbidden, notFound } from '../lib/errors';
import type { AppEvents } from './events';

/** Largest photo accepted (bytes). */
export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;
/** Longest side of a thumbnail (pixels). */
export const THUMB_SIZE = 320;
/** Largest side kept of the full image (pixels); larger photos are scaled down. */
export const MAX_SIDE = 4096;

type Format = 'jpeg' | 'png' | 'webp';
const MIME: Record<Format, string> = { jpeg: 'image/jpeg', png: 'image/png', webp: 'image/webp' };
const EXT: Record<Format, string> = { jpeg: 'jpg', png: 'png', webp: 'webp' };

/** The image format by its first bytes, or null. */
export function sniffImage(buf: Uint8Array): Format | null {
  if (buf.length >= 3 && buf[0] === 0xff && buf[1] === 0xd8 && buf[2] === 0xff) return 'jpeg';
  if (buf.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((b, i) => buf[i] === b)) return 'png';
  if (buf.length >= 12 && String.fromCharCode(...buf.subarray(0, 4)) === 'RIFF' && String.fromCharCode(...buf.subarray(8, 12)) === 'WEBP') return 'webp';
  return null;
}

/** The shown name of an upload, or a 400 when it tries to name a folder (`../x.jpg`, `a/b.png`, `C:\\x`). */
export function displayName(name: string | undefined): string {
  const n = (name ?? '').normalize('NFC');
  if (!n) return 'photo';
  if (/[/\\]/.test(n) || [...n].some((c) => c.charCodeAt(0) < 32 || c.charCodeAt(0) === 127) || n.split('.').every((s) => s === '') || n.includes('..') || /^[a-zA-Z]:/.test(n)) {
    throw badRequest('invalid_input', 'The file name must be a plain name, without folders', { file: 'file name names a folder or holds control characters' });
  }
  return n.slice(0, 200);
}

/** A photo as the API gives it. */
export interface ApiPhoto {
  id: number;
  boardId: number;
  partId: string | null;
  name: string;
  caption: string;
  mime: string;
  bytes: number;
  width: number;
  height: number;
  uploader: { id: number; name: string } | null;
  createdAt: string;
  url: string;
  thumbUrl: string;
}

function toApi(r: PhotoRow): ApiPhoto {
  const base = `/api/boards/${r.board_id}/photos/${r.id}`;
  return {
    id: r.id, boardId: r.board_id, partId: r.part_id, name: r.original_name, caption: r.caption, mime: r.mime, bytes: r.bytes,
    width: r.width, height: r.height, uploader: r.uploader_id === null ? null : { id: r.uploader_id, name: r.uploader_name ?? '' },
    createdAt: r.created_at, url: `${base}/file`, thumbUrl: `${base}/thumb`,
  };
}

export interface PhotoUpload {
  buffer: Buffer;
  originalname?: string;
  partId?: string;
  caption?: string;
}

export interface PhotosService {
  list(boardId: number): Promise<ApiPhoto[]>;
  upload(boardId: number, userId: number, file: PhotoUpload): Promise<ApiPhoto>;
  /** Absolute path and type of a photo's file or thumbnail (404 when missing). */
  file(boardId: number, photoId: number, which: 'file' | 'thumb'): Promise<{ path: string; mime: string }>;
  remove(boardId: number, photoId: number, userId: number, role: BoardRole): Promise<void>;
  /** Removes every file of the board (its rows go with the board). */
  removeBoardFiles(boardId: number): Promise<void>;
}

export function createPhotosService(deps: { db: Db; uploadDir: string; events: AppEvents; readBoardFile(boardId: number): Promise<BoardFile> }): PhotosService {
  const { db } = deps;
  const root = resolve(deps.uploadDir, 'photos');
  const dirOf = (boardId: number) => join(root, `board-${Math.trunc(boardId)}`);
  const service: PhotosService = {
    list: async (boardId) => (await listPhotos(db, boardId)).map(toApi),
    async upload(boardId, userId, up) {
      const name = displayName(up.originalname);
      const format = sniffImage(up.buffer);
      if (!format) throw badRequest('not_an_image', 'Upload a JPEG, PNG or WebP photo', { file: 'the content is not a JPEG, PNG or WebP image' });
      const partId = up.partId?.trim() || null;
      if (partId) {
        const board = await deps.readBoardFile(boardId);
        if (!board.parts.some((p) => p.id === partId)) throw badRequest('invalid_input', `No part "${partId}" on this board`, { partId: 'no such part on the board' });
      }
      const caption = (up.caption ?? '').trim().slice(0, 200);
      let full: { data: Buffer; info: OutputInfo };
      let thumb: Buffer;
      try {
        const meta = await sharp(up.buffer).metadata();
        if (meta.format !== format) throw new Error(`content reads as ${meta.format ?? 'nothing'}`);
        // rotate() turns the image upright by its EXIF orientation; the output keeps no metadata
        const upright = sharp(up.buffer).rotate().resize({ width: MAX_SIDE, height: MAX_SIDE, fit: 'inside', withoutEnlargement: true });
        full = await upright.toFormat(format).toBuffer({ resolveWithObject: true });
        thumb = await sharp(full.data).resize({ width: THUMB_SIZE, height: THUMB_SIZE, fit: 'inside', withoutEnlargement: true }).webp({ quality: 80 }).toBuffer();
      } catch (err) {
        throw badRequest('not_an_image', 'The photo could not be read as an image', { file: (err as Error).message.slice(0, 200) });
      }
      const dir = dirOf(boardId);
      await mkdir(dir, { recursive: true });
      const stem = randomBytes(12).toString('hex');
      const fileName = `${stem}.${EXT[format]}`;
      const thumbName = `${stem}-thumb.webp`;
      await writeFile(join(dir, fileName), full.data);
      await writeFile(join(dir, thumbName), thumb);
      try {
        const id = await insertPhoto(db, {
          board_id: boardId, part_id: partId, uploader_id: userId, file_name: fileName, thumb_name: thumbName, original_name: name,
          mime: MIME[format], bytes: full.data.length, width: full.info.width, height: full.info.height, caption, created_at: nowIso(),
        });
        return toApi((await getPhoto(db, boardId, id))!);
      } catch (err) {
        await Promise.allSettled([unlink(join(dir, fileName)), unlink(join(dir, thumbName))]);
        throw err;
      }
    },
    async file(boardId, photoId, which) {
      const row = await getPhoto(db, boardId, photoId);
      if (!row) throw notFound('photo_not_found', 'No such photo on this board');
      return which === 'file' ? { path: join(dirOf(boardId), row.file_name), mime: row.mime } : { path: join(dirOf(boardId), row.thumb_name), mime: 'image/webp' };
    },
    async remove(boardId, photoId, userId, role) {
      const row = await getPhoto(db, boardId, photoId);
      if (!row) throw notFound('photo_not_found', 'No such photo on this board');
      if (row.uploader_id !== userId && role !== 'owner') throw forbidden('role_too_low', 'Only who uploaded a photo, or the owner, deletes it');
      await deletePhoto(db, boardId, photoId);
      await Promise.allSettled([unlink(join(dirOf(boardId), row.file_name)), unlink(join(dirOf(boardId), row.thumb_name))]);
    },
    removeBoardFiles: (boardId) => rm(dirOf(boardId), { recursive: true, force: true }),
  };
  deps.events.on('board-deleted', ({ boardId }) => {
    service.removeBoardFiles(boardId).catch((err: unknown) => console.error(`could not remove the photos of board ${boardId}:`, err));
  });
  return service;
}
