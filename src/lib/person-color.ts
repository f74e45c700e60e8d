/**
 * One colour per person, everywhere a person is shown (the presence bar, cursors and selections on the
 * canvas, avatars in the members list and the header): picked from our palette by a hash of the user's
 * id, so it never changes with their name or the screen.
 */
export const PERSON_COLORS = ['#4cc9f0', '#80ed99', '#c77dff', '#ff7b72', '#f4d35e', '#56cfe1', '#e5989b', '#b8f2e6'];

/** The colour of the person with this user id (a guest: their guest id). */
export function personColor(userId: string | number): string {
  const key = String(userId);
  let h = 0;
  for (let i = 0; i < key.length; i++) h = (h * 31 + key.charCodeAt(i)) >>> 0;
  return PERSON_COLORS[h % PERSON_COLORS.length];
}
