/**
 * Whether the canvas is zoomed out far enough to draw plain boxes. Read ONCE per canvas (one store
 * subscription in the canvas) and handed to the parts through a context: a `useStore` in every part
 * would run a thousand selectors on every pan frame of a 1,000-part board.
 */
import { createContext } from 'react';
import type { ReactFlowState } from '@xyflow/react';

/** Below this zoom a part is drawn as a plain box: a thousand detailed symbols cost whole frames to paint. */
export const DETAIL_ZOOM = 0.45;

/** Store selector: true while zoomed out below DETAIL_ZOOM. */
export const zoomedOut = (s: ReactFlowState): boolean => s.transform[2] < DETAIL_ZOOM;

/** True while the canvas is zoomed out (plain boxes); provided by the board canvas. */
export const FarContext = createContext(false);
