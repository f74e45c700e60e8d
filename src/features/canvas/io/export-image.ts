/** PNG and SVG pictures of the whole board (every part, whatever the current pan and zoom), with html-to-image. */
import { getNodesBounds, getViewportForBounds, type Node } from '@xyflow/react';
import { toPng, toSvg } from 'html-to-image';
import { INK } from '../lib/colors';

const PAD = 40;

/** Renders the flow viewport of `container` fitted around `nodes`; `format` picks PNG or SVG. */
export async function renderBoardImage(container: HTMLElement, nodes: Node[], format: 'png' | 'svg'): Promise<string> {
  const viewportEl = container.querySelector<HTMLElement>('.react-flow__viewport');
  if (!viewportEl) throw new Error('the canvas is not shown');
  const bounds = getNodesBounds(nodes);
  const width = Math.min(8000, Math.max(200, Math.ceil(bounds.width + 2 * PAD)));
  const height = Math.min(8000, Math.max(150, Math.ceil(bounds.height + 2 * PAD)));
  const vp = getViewportForBounds(bounds, width, height, 0.1, 2, PAD);
  const options = {
    backgroundColor: INK.canvas,
    width,
    height,
    style: { width: `${width}px`, height: `${height}px`, transform: `translate(${vp.x}px, ${vp.y}px) scale(${vp.zoom})` },
    // Controls, minimap and handles' hover helpers are not part of the drawing.
    filter: (el: HTMLElement) => !(el.classList?.contains('react-flow__minimap') || el.classList?.contains('react-flow__controls')),
  };
  return format === 'png' ? toPng(viewportEl, options) : toSvg(viewportEl, options);
}
