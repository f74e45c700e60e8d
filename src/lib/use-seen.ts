import { useEffect, useRef, type RefObject } from 'react';

/**
 * Calls `onSeen` once, the first time the element comes within `margin` of the visible area (also
 * inside a scrolled panel column): work for a panel can wait until someone looks at it.
 */
export function useSeen<T extends Element>(onSeen: () => void, margin = '200px'): RefObject<T | null> {
  const ref = useRef<T>(null);
  const cb = useRef(onSeen);
  cb.current = onSeen;
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    if (typeof IntersectionObserver !== 'function') { cb.current(); return; }
    const io = new IntersectionObserver((entries) => {
      if (!entries.some((e) => e.isIntersecting)) return;
      io.disconnect();
      cb.current();
    }, { rootMargin: margin });
    io.observe(el);
    return () => io.disconnect();
  }, [margin]);
  return ref;
}
