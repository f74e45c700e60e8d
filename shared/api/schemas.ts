import { z } from 'zod';
import { FAMILY_IDS } from '../board';

/** Roles a member can be given; the owner role is held only by the board's creator. */
export const MemberRoleSchema = z.enum(['editor', 'viewer'], {
  error: 'Role must be "editor" or "viewer"',
});

/** An e-mail address, trimmed and lower-cased so that lookups ignore case. */
export const EmailSchema = z
  .string({ error: 'E-mail is required' })
  .trim()
  .min(1, 'E-mail is required')
  .max(254, 'E-mail is too long')
  .pipe(z.email({ error: 'Enter a valid e-mail address' }))
  .transform((s) => s.toLowerCase());

/** A new password: at least 8 characters (bcrypt reads at most 72 bytes, so we cap there). */
export const PasswordSchema = z
  .string({ error: 'Password is required' })
  .min(8, 'Password must be at least 8 characters')
  .max(72, 'Password must be at most 72 characters');

/** A logic family id (the board file's `family`). */
export const BoardFamilySchema = z.enum(FAMILY_IDS, {
  error: `Family must be one of ${FAMILY_IDS.join(', ')}`,
});

/** A board title as typed by a user. */
export const TitleSchema = z
  .string({ error: 'Title is required' })
  .trim()
  .min(1, 'Title is required')
  .max(200, 'Title must be at most 200 characters');

/** Body of `POST /api/auth/signup`. */
export const SignupSchema = z.object({
  email: EmailSchema,
  password: PasswordSchema,
  name: z
    .string({ error: 'Name is required' })
    .trim()
    .min(1, 'Name is required')
    .max(100, 'Name must be at most 100 characters'),
});
export type SignupBody = z.infer<typeof SignupSchema>;

/** Body of `POST /api/auth/login`. Any non-empty password is accepted here; the check is the server's. */
export const LoginSchema = z.object({
  email: EmailSchema,
  password: z.string({ error: 'Password is required' }).min(1, 'Password is required').max(1000, 'Password is too long'),
});
export type LoginBody = z.infer<typeof LoginSchema>;

/** Body of `POST /api/auth/reset-request`. */
export const ResetRequestSchema = z.object({ email: EmailSchema });
export type ResetRequestBody = z.infer<typeof ResetRequestSchema>;

/** Body of `POST /api/auth/reset`: the token from the e-mailed link and the new password. */
export const ResetSchema = z.object({
  token: z.string({ error: 'Token is required' }).min(1, 'Token is required').max(200, 'Token is too long'),
  password: PasswordSchema,
});
export type ResetBody = z.infer<typeof ResetSchema>;

/** Body of `POST /api/boards`. */
export const CreateBoardSchema = z.object({
  title: TitleSchema,
  family: BoardFamilySchema.optional(),
});
export type CreateBoardBody = z.infer<typeof CreateBoardSchema>;

/** Body of `PATCH /api/boards/:id`: at least one of title and family. */
export const UpdateBoardSchema = z
  .object({ title: TitleSchema.optional(), family: BoardFamilySchema.optional() })
  .refine((b) => b.title !== undefined || b.family !== undefined, {
    message: 'Give a title or a family to change',
    path: ['title'],
  });
export type UpdateBoardBody = z.infer<typeof UpdateBoardSchema>;

/** Body of `POST /api/boards/:id/members`. */
export const AddMemberSchema = z.object({ email: EmailSchema, role: MemberRoleSchema });
export type AddMemberBody = z.infer<typeof AddMemberSchema>;

/** Body of `PATCH /api/boards/:id/members/:userId`. */
export const UpdateMemberSchema = z.object({ role: MemberRoleSchema });
export type UpdateMemberBody = z.infer<typeof UpdateMemberSchema>;

/** A numeric id in a URL path (`:id`, `:userId`). */
export const IdParamSchema = z.coerce
  .number({ error: 'Must be a number' })
  .int('Must be a whole number')
  .positive('Must be a positive number');

/** A snapshot's name as typed by a user. */
export const SnapshotNameSchema = z
  .string({ error: 'Name is required' })
  .trim()
  .min(1, 'Name is required')
  .max(120, 'Name must be at most 120 characters');

/** Body of `POST /api/boards/:id/snapshots`: a named snapshot (the name defaults to the time). */
export const CreateSnapshotSchema = z.object({ name: SnapshotNameSchema.optional() });
export type CreateSnapshotBody = z.infer<typeof CreateSnapshotSchema>;

/** Body of `PATCH /api/boards/:id/snapshots/:sid`. */
export const RenameSnapshotSchema = z.object({ name: SnapshotNameSchema });
export type RenameSnapshotBody = z.infer<typeof RenameSnapshotSchema>;

/** Body of `POST /api/boards/:id/copy`: the live board, or one of its snapshots. */
export const CopyBoardSchema = z.object({
  snapshotId: z.number({ error: 'snapshotId must be a number' }).int('snapshotId must be a whole number').positive('snapshotId must be positive').optional(),
});
export type CopyBoardBody = z.infer<typeof CopyBoardSchema>;
