import { z } from 'zod';

/** `POST /api/boards/:id/share-links`: an optional lifetime (a link without one lasts until revoked). */
export const CreateShareLinkSchema = z.object({
  expiresInMinutes: z
    .number({ error: 'The lifetime must be a number of minutes' })
    .int('The lifetime must be a whole number of minutes')
    .min(1, 'The lifetime must be at least 1 minute')
    .max(60 * 24 * 366, 'The lifetime must be at most a year')
    .optional(),
});
export type CreateShareLinkBody = z.infer<typeof CreateShareLinkSchema>;

/** `POST /api/share/:token/join`: the name a guest shows to the class. */
export const JoinShareSchema = z.object({
  name: z.string({ error: 'Give a display name' }).trim().min(1, 'Give a display name').max(40, 'A display name has at most 40 characters'),
});
export type JoinShareBody = z.infer<typeof JoinShareSchema>;

/** A share link as created: the token is shown this once (only its hash is stored). */
export interface ApiNewShareLink {
  id: number;
  token: string;
  /** `<PUBLIC_URL or the allowed host>/s/<token>` */
  url: string;
  createdAt: string;
  expiresAt: string | null;
}

/** A share link as listed: no token. `audience` = guests connected through it now. */
export interface ApiShareLink {
  id: number;
  createdAt: string;
  expiresAt: string | null;
  audience: number;
}

/** What a share link opens (`GET /api/share/:token`); `guest` when this session already joined through it. */
export interface ApiShareInfo {
  boardId: number;
  title: string;
  expiresAt: string | null;
  guest: { name: string } | null;
  /** the signed-in user's own role on the board, if a member (members keep their role) */
  memberRole: 'owner' | 'editor' | 'viewer' | null;
}
