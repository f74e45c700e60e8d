/**
 * Viewport follow for class mode (lead / follow): publish this canvas's viewport as it changes, and
 * follow someone else's — the same middle and zoom, animated, and given up as soon as the user pans or zooms by hand. Call these
 * inside the workspace (under its ReactFlowProvider), e.g. from a side panel.
 */
import { useEffect, useRef } from 'react';
import { useOnViewportChange, useReactFlow, useStoreApi, type Viewport } from '@xyflow/react';

export type { Viewport };

/** A viewport with the size of the canvas it was on (px), so a canvas of another size shows the same middle. */
export interface SizedViewport extends Viewport {
  w?: number;
  h?: number;
}

/** Calls `publish` with the viewport now and on every change while `enabled`. */
export function useViewportPublish(enabled: boolean, publish: (v: SizedViewport) => void): void {
  const flow = useReactFlow();
  const store = useStoreApi();
  const ref = useRef(publish);
  ref.current = publish;
  const sized = (v: Viewport): SizedViewport => { const { width, height } = store.getState(); return { ...v, w: width, h: height }; };
  useOnViewportChange({ onChange: (v) => { if (enabled) ref.current(sized(v)); } });
  useEffect(() => { if (enabled) ref.current(sized(flow.getViewport())); }, [enabled, flow]);
}

/**
 * Moves this canvas to `target` (200 ms) whenever it changes while `following`; a wheel, a pinch or a
 * drag on the empty canvas by the user calls `onManual` (the caller stops following).
 */
export function useViewportFollow(target: SizedViewport | null, following: boolean, onManual: () => void): void {
  const flow = useReactFlow();
  const store = useStoreApi();
  const manual = useRef(onManual);
  manual.current = onManual;
  const x = target?.x; const y = target?.y; const zoom = target?.zoom; const w = target?.w; const h = target?.h;
  useEffect(() => {
    if (!following || x === undefined || y === undefined || zoom === undefined) return;
    // the same point in the middle of both canvases
    const { width, height } = store.getState();
    const dx = w && width ? (width - w) / 2 : 0;
    const dy = h && height ? (height - h) / 2 : 0;
    void flow.setViewport({ x: x + dx, y: y + dy, zoom }, { duration: 200 });
  }, [following, x, y, zoom, w, h, flow, store]);
  useEffect(() => {
    if (!following) return;
    const onUser = (e: Event) => {
      const el = e.target instanceof Element ? e.target : null;
      if (!el?.closest('.react-flow')) return;
      // a pointer press on a part (a viewer's try-out switch) is not a pan
      if (e.type === 'pointerdown' && !el.closest('.react-flow__pane')) return;
      manual.current();
    };
    const opts = { capture: true, passive: true } as const;
    document.addEventListener('wheel', onUser, opts);
    document.addEventListener('pointerdown', onUser, opts);
    document.addEventListener('touchstart', onUser, opts);
    return () => {
      document.removeEventListener('wheel', onUser, opts);
      document.removeEventListener('pointerdown', onUser, opts);
      document.removeEventListener('touchstart', onUser, opts);
    };
  }, [following]);
}
