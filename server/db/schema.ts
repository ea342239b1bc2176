import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';

/** Account roles (design.md §3). */
export const ROLES = ['admin', 'designer', 'quilter'] as const;
export type Role = (typeof ROLES)[number];

/** Access a member has to one pattern; the owner is not a member row. */
export const MEMBER_ACCESS = ['co-designer', 'quilter'] as const;
export type MemberAccess = (typeof MEMBER_ACCESS)[number];

/** Sewing-log stages of a section, in the order a quilter reaches them. */
export const SEWING_STAGES = ['cut', 'sewn', 'trimmed'] as const;
export type SewingStage = (typeof SEWING_STAGES)[number];

export const PRINT_SET_STATUSES = ['queued', 'rendering', 'done', 'failed'] as const;
export type PrintSetStatus = (typeof PRINT_SET_STATUSES)[number];

const createdAt = () =>
  integer('created_at', { mode: 'timestamp_ms' })
    .notNull()
    .default(sql`(unixepoch('subsec') * 1000)`);

export const users = sqliteTable('users', {
  id: text('id').primaryKey(),
  /** Lower-cased. */
  email: text('email').notNull().unique(),
  displayName: text('display_name').notNull(),
  passwordHash: text('password_hash').notNull(),
  role: text('role', { enum: ROLES }).notNull(),
  disabled: integer('disabled', { mode: 'boolean' }).notNull().default(false),
  createdAt: createdAt(),
});

/** Sign-in sessions; only the SHA-256 of the cookie's token is stored. */
export const sessions = sqliteTable(
  'sessions',
  {
    tokenHash: text('token_hash').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);

/** Single-use password-reset tokens (SHA-256 stored), one hour each. */
export const passwordResets = sqliteTable(
  'password_resets',
  {
    tokenHash: text('token_hash').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
    usedAt: integer('used_at', { mode: 'timestamp_ms' }),
  },
  (t) => [index('password_resets_user_idx').on(t.userId)],
);

export const patterns = sqliteTable(
  'patterns',
  {
    id: text('id').primaryKey(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    /** Copy of the latest revision's title, for listing and search. */
    title: text('title').notNull(),
    /** Number of the latest revision (1, 2, …). */
    headRevision: integer('head_revision').notNull(),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
    trashedAt: integer('trashed_at', { mode: 'timestamp_ms' }),
  },
  (t) => [index('patterns_owner_idx').on(t.ownerId)],
);

/** Every save of a pattern; never updated after insert. */
export const revisions = sqliteTable(
  'revisions',
  {
    id: text('id').primaryKey(),
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    /** The validated pattern document as JSON. */
    document: text('document').notNull(),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    /** The revision this one was restored from, when it is a restore. */
    restoredFrom: integer('restored_from'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('revisions_pattern_number_idx').on(t.patternId, t.number)],
);

export const members = sqliteTable(
  'members',
  {
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    access: text('access', { enum: MEMBER_ACCESS }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.patternId, t.userId] }), index('members_user_idx').on(t.userId)],
);

export const invitations = sqliteTable(
  'invitations',
  {
    id: text('id').primaryKey(),
    tokenHash: text('token_hash').notNull().unique(),
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    access: text('access', { enum: MEMBER_ACCESS }).notNull(),
    invitedBy: text('invited_by')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
    acceptedAt: integer('accepted_at', { mode: 'timestamp_ms' }),
    acceptedBy: text('accepted_by').references(() => users.id, { onDelete: 'set null' }),
    revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
  },
  (t) => [index('invitations_pattern_idx').on(t.patternId)],
);

export const sewingLog = sqliteTable(
  'sewing_log',
  {
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    sectionId: text('section_id').notNull(),
    stage: text('stage', { enum: SEWING_STAGES }).notNull(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.patternId, t.userId, t.sectionId] })],
);

/** Reference images uploaded to a pattern; the file lives under the data folder. */
export const uploads = sqliteTable(
  'uploads',
  {
    id: text('id').primaryKey(),
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    uploaderId: text('uploader_id')
      .notNull()
      .references(() => users.id),
    fileName: text('file_name').notNull(),
    mimeType: text('mime_type').notNull(),
    bytes: integer('bytes').notNull(),
    sha256: text('sha256').notNull(),
    /** Path relative to the data folder. */
    storagePath: text('storage_path').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('uploads_pattern_idx').on(t.patternId)],
);

/** Rendered print sets (PDF) of one stored revision. */
export const printSets = sqliteTable(
  'print_sets',
  {
    id: text('id').primaryKey(),
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    revisionId: text('revision_id')
      .notNull()
      .references(() => revisions.id, { onDelete: 'cascade' }),
    revisionNumber: integer('revision_number').notNull(),
    createdBy: text('created_by')
      .notNull()
      .references(() => users.id),
    /** Print options as JSON. */
    options: text('options').notNull(),
    status: text('status', { enum: PRINT_SET_STATUSES }).notNull(),
    /** 0…1 while rendering. */
    progress: real('progress').notNull().default(0),
    error: text('error'),
    /** Pages in the PDF (cover, template sheets, cutting list). */
    sheets: integer('sheets'),
    /** N: sheets carrying templates (the cover states N against M). */
    templateSheets: integer('template_sheets'),
    lowerBoundSheets: integer('lower_bound_sheets'),
    bytes: integer('bytes'),
    sha256: text('sha256'),
    /** Path relative to the data folder. */
    storagePath: text('storage_path'),
    createdAt: createdAt(),
    finishedAt: integer('finished_at', { mode: 'timestamp_ms' }),
  },
  (t) => [index('print_sets_pattern_idx').on(t.patternId)],
);

export type User = typeof users.$inferSelect;
export type Pattern = typeof patterns.$inferSelect;
export type Revision = typeof revisions.$inferSelect;
export type Member = typeof members.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;
export type Upload = typeof uploads.$inferSelect;
export type PrintSet = typeof printSets.$inferSelect;
