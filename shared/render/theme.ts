/** Colours of a board picture: the dark work mat of the canvas, or a light theme for printing. */
export interface RenderTheme {
  background: string;
  stroke: string;
  fill: string;
  text: string;
  dim: string;
  wire: string;
  /** the lever of a switch that is on, a constant 1 */
  on: string;
}

export const MAT_THEME: RenderTheme = {
  background: '#0d1014', stroke: '#c7ced8', fill: '#1a2028', text: '#d5dbe3', dim: '#8b95a3', wire: '#7d8590', on: '#ffb347',
};

export const PRINT_THEME: RenderTheme = {
  background: '#ffffff', stroke: '#1f2328', fill: '#ffffff', text: '#1f2328', dim: '#57606a', wire: '#3d444d', on: '#1f2328',
};

/**
 * What a compare marks on a part or a wire. The colours are our own and stay away from the signal
 * colours (amber high, slate low, magenta X, grey Z): teal added, rose removed, violet changed.
 */
export type CompareMark = 'added' | 'removed' | 'changed';

export const MARK_COLORS: Record<CompareMark, string> = { added: '#2ec4b6', removed: '#f2727f', changed: '#a78bfa' };

export const FONT = '"JetBrains Mono", ui-monospace, monospace';

/** Text safe inside SVG markup (element content and attribute values). */
export function xmlEscape(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}
