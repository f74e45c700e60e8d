/**
 * The `?next=` target after signing in: only a path inside this app, so a crafted link cannot send
 * someone to another site after they typed their password.
 */
export function safeNext(raw: string | null | undefined, fallback = '/boards'): string {
  if (!raw || !raw.startsWith('/') || raw.startsWith('//') || raw.startsWith('/\\')) return fallback;
  return raw;
}

/** `/signin?next=<current path>` for a page that needs an account. */
export function signInPath(next: string, base: '/signin' | '/signup' = '/signin'): string {
  return `${base}?next=${encodeURIComponent(next)}`;
}
