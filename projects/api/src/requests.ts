/*
 * Bodies the server takes, as the zod schemas it validates them with (docs/api.md, "Strict input"):
 * the server parses with these, the app may check a form with them before sending.
 */
import { z } from 'zod';
import { MEMBER_ACCESS, ROLES, SEWING_STAGES } from './constants';
import { multiLineText, singleLineText } from './text';

/** Ids made by the server: url-safe letters and digits, nothing that can walk a path. */
export const idSchema = z
  .string()
  .regex(/^[A-Za-z0-9_-]{1,64}$/, 'must be an id of letters, digits, "-" or "_"');

/** E-mail addresses, trimmed and lower-cased. */
export const emailSchema = z
  .string()
  .trim()
  .max(254)
  .pipe(z.email({ message: 'must be an e-mail address' }))
  .transform((v) => v.toLowerCase());

/** Longest password in UTF-8 bytes: bcrypt reads at most 72 bytes of its input. */
export const PASSWORD_MAX_BYTES = 72;
/** Shortest password, in characters. */
export const PASSWORD_MIN_LENGTH = 10;

/** Passwords: long enough to matter, short enough for bcrypt's 72-byte input. */
export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
  .refine((v) => new TextEncoder().encode(v).length <= PASSWORD_MAX_BYTES, { message: `must be at most ${PASSWORD_MAX_BYTES} bytes` });

/** `POST /api/auth/sign-up`. */
export const signUpBodySchema = z.strictObject({
  email: emailSchema,
  password: passwordSchema,
  displayName: z.string().overwrite(singleLineText).trim().min(1).max(80),
  role: z.enum(['designer', 'quilter']),
});
export type SignUpBody = z.input<typeof signUpBodySchema>;

/** `POST /api/auth/sign-in`. */
export const signInBodySchema = z.strictObject({ email: emailSchema, password: z.string().min(1).max(200) });
export type SignInBody = z.input<typeof signInBodySchema>;

/** `POST /api/auth/change-password`. */
export const changePasswordBodySchema = z.strictObject({ currentPassword: z.string().min(1).max(200), newPassword: passwordSchema });
export type ChangePasswordBody = z.input<typeof changePasswordBodySchema>;

/** `POST /api/auth/password-reset`. */
export const resetRequestBodySchema = z.strictObject({ email: emailSchema });
export type ResetRequestBody = z.input<typeof resetRequestBodySchema>;

/** `POST /api/auth/password-reset/confirm`. */
export const resetConfirmBodySchema = z.strictObject({ token: z.string().min(20).max(100), newPassword: passwordSchema });
export type ResetConfirmBody = z.input<typeof resetConfirmBodySchema>;

/** `POST /api/patterns/:id/invitations`. */
export const invitationBodySchema = z.strictObject({ email: emailSchema, access: z.enum(MEMBER_ACCESS) });
export type InvitationBody = z.input<typeof invitationBodySchema>;

/** `PATCH /api/patterns/:id/members/:userId`. */
export const memberAccessBodySchema = z.strictObject({ access: z.enum(MEMBER_ACCESS) });
export type MemberAccessBody = z.input<typeof memberAccessBodySchema>;

/** The token of an invitation link. */
export const invitationTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'must be an invitation token');

/** `POST /api/invitations/accept`. */
export const acceptInvitationBodySchema = z.strictObject({ token: invitationTokenSchema });
export type AcceptInvitationBody = z.input<typeof acceptInvitationBodySchema>;

/** Largest copy number the sewing log takes: ring repeats (≤ 360) × blocks (≤ 1000). */
export const MAX_SEWING_COPY = 360_000;

/**
 * `PUT /api/patterns/:id/sewing-log/:sectionId`: the stage one copy of the section has reached, or null to
 * clear it. `copy` counts from 1 (ring copies of block 1, then of block 2 …); the first copy when missing.
 */
export const sewingStageBodySchema = z.strictObject({
  stage: z.enum(SEWING_STAGES).nullable(),
  copy: z.number().int().min(1).max(MAX_SEWING_COPY).default(1),
});
export type SewingStageBody = z.input<typeof sewingStageBodySchema>;

/** The board's editing session, sent with its saves: consecutive saves of one session form one row in History. */
export const editSessionSchema = z.string().regex(/^[A-Za-z0-9_-]{8,64}$/, 'must be 8 to 64 letters, digits, "-" or "_"');

/** `POST /api/patterns`: the document is checked by piecing's schema afterwards. */
export const createPatternBodySchema = z.strictObject({ document: z.unknown() });

/** `PUT /api/patterns/:id`: a save on top of `baseRevision`. */
export const saveRevisionBodySchema = z.strictObject({
  baseRevision: z.number().int().min(1),
  document: z.unknown(),
  editSession: editSessionSchema.optional(),
});

/** `POST /api/patterns/:id/duplicate`. */
export const duplicateBodySchema = z.strictObject({ title: z.string().overwrite(singleLineText).trim().min(1).max(120).optional() });

/** `POST /api/patterns/:id/revisions/:number/restore`. */
export const restoreBodySchema = z.strictObject({ baseRevision: z.number().int().min(1) });
export type RestoreBody = z.input<typeof restoreBodySchema>;

/** `POST /api/patterns/:id/revisions`: a named version, of `document` or of the latest revision. */
export const saveVersionBodySchema = z.strictObject({
  baseRevision: z.number().int().min(1),
  name: z.string().overwrite(singleLineText).trim().min(1, 'must not be empty').max(80, 'must be at most 80 characters'),
  note: z.string().overwrite(multiLineText).trim().max(500, 'must be at most 500 characters').optional(),
  /** The document to keep; the latest revision's when omitted. */
  document: z.unknown().optional(),
  editSession: editSessionSchema.optional(),
});

/** `PATCH /api/admin/users/:userId`. */
export const userChangeBodySchema = z
  .strictObject({ role: z.enum(ROLES).optional(), disabled: z.boolean().optional() })
  .refine((b) => b.role !== undefined || b.disabled !== undefined, { message: 'give role or disabled' });
export type UserChangeBody = z.input<typeof userChangeBodySchema>;

/** `POST /api/patterns/:id/print-sets`: the options are checked by piecing's print options schema afterwards. */
export const printSetBodySchema = z.strictObject({
  revision: z.number().int().min(1).optional(),
  options: z.record(z.string(), z.unknown()).default({}),
  /**
   * Whether to print a pattern with a section not sewable as numbered (every page of such a section then
   * says so); without it such a pattern is refused with 422 and the reason. Same as `options.printUnsewable`.
   */
  printUnsewable: z.boolean().optional(),
  /** The caller's own colourway copy of this pattern (docs/api.md "Colourway copies"): the set is in its fabrics. */
  colourwayCopyId: idSchema.optional(),
});
