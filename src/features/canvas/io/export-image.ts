/**
 * SVG and PNG pictures of the whole board, whatever the current pan and zoom: drawn by the shared
 * renderer (real vector shapes and text, framed to the parts with a margin); the PNG rasterises that
 * same SVG through an Image and a canvas.
 */
import type { BoardFile } from '../../../../shared/board';
import { renderBoardSvg, type BoardSvgOptions } from '../../../../shared/render';

/** Largest PNG side in pixels (browsers refuse much larger canvases). */
const MAX_PNG_SIDE = 8000;

function svgDataUrl(svg: string): string {
  return `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
}

/** Draws `svg` (w×h) on a canvas at `scale` and returns a PNG data URL. */
async function rasterise(svg: string, w: number, h: number, scale: number): Promise<string> {
  const img = new Image();
  img.decoding = 'sync';
  await new Promise<void>((resolve, reject) => {
    img.onload = () => resolve();
    img.onerror = () => reject(new Error('the picture could not be drawn'));
    img.src = svgDataUrl(svg);
  });
  const canvas = document.createElement('canvas');
  canvas.width = Math.max(1, Math.round(w * scale));
  canvas.height = Math.max(1, Math.round(h * scale));
  const ctx = canvas.getContext('2d');
  if (!ctx) throw new Error('this browser cannot draw a PNG');
  ctx.drawImage(img, 0, 0, canvas.width, canvas.height);
  return canvas.toDataURL('image/png');
}

/** A data URL of the board as an SVG or PNG picture. */
export async function renderBoardImage(board: BoardFile, format: 'png' | 'svg', options: BoardSvgOptions = {}): Promise<string> {
  const out = renderBoardSvg(board, options);
  if (format === 'svg') return svgDataUrl(out.svg);
  const scale = Math.min(2, MAX_PNG_SIDE / Math.max(out.width, out.height));
  return rasterise(out.svg, out.width, out.height, scale);
}
