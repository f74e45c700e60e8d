/**
 * Live password-reset links must not be kept in readable form: the built-in catcher stores every message
 * for the admin's Outbox with their tokens masked. The real SMTP delivery carries the link; locally the
 * catcher prints it to the server console (`logMailLinks`). Invitation links are still stored readable:
 * the demo and the browser tests accept invitations from the Outbox (masking them too is left open).
 */
const RESET_LINK = /(\/reset\/)([A-Za-z0-9_-]{8,})/g;

/** What a masked token reads as in the Outbox. */
export const MASKED_TOKEN = 'hidden-see-server-console';

/** The note stored with a message whose links were masked. */
export const MASK_NOTE =
  '[Outbox: the password-reset link in this message is hidden. It was delivered by e-mail; with the built-in catcher the server console prints it.]';

/** Reset links in `text` with their tokens replaced, and the live links that were found. */
export function maskSecretLinks(text: string): { text: string; masked: number } {
  let masked = 0;
  const out = text.replace(RESET_LINK, (_m, prefix: string) => {
    masked++;
    return `${prefix}${MASKED_TOKEN}`;
  });
  return { text: out, masked };
}

/** The reset links (full URLs) in a message's plain text, for the console of a local server. */
export function secretLinksIn(text: string): string[] {
  return [...new Set(text.match(/https?:\/\/\S+\/reset\/[A-Za-z0-9_-]{8,}/g) ?? [])];
}
