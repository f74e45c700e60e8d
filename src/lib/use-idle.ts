import { useEffect, useState } from 'react';

/**
 * `value` as of the browser's last idle moment (`initial` before the first): work on it waits until the
 * page has drawn what it was drawing (at most `timeout` ms), then follows each change at the next idle.
 */
export function useIdleValue<T>(value: T, initial: T, timeout = 2000): T {
  const [idle, setIdle] = useState(initial);
  useEffect(() => {
    if (typeof requestIdleCallback !== 'function') { setIdle(() => value); return; }
    const handle = requestIdleCallback(() => setIdle(() => value), { timeout });
    return () => cancelIdleCallback(handle);
  }, [value, timeout]);
  return idle;
}

/** False until the browser's first idle moment after the component mounted, then true. */
export function useIdle(timeout = 2000): boolean {
  return useIdleValue(true, false, timeout);
}
