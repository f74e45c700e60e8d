const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** A stored ISO timestamp (or epoch ms) as a short local date and time; the raw value if unparsable. */
export function formatDateTime(value: string | number | null | undefined): string {
  if (value === null || value === undefined || value === '') return '—';
  const d = new Date(value);
  return Number.isNaN(d.getTime()) ? String(value) : dateTime.format(d);
}

/** Up to two initials from a display name (or an e-mail address when there is no name). */
export function initialsOf(name: string): string {
  const words = name.replace(/@.*$/, '').split(/[\s._-]+/).filter(Boolean);
  const letters = words.length > 1 ? [words[0][0], words[words.length - 1][0]] : [words[0]?.[0] ?? '?', words[0]?.[1] ?? ''];
  return letters.join('').toUpperCase();
}
