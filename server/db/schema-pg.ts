/**
 * The PostgreSQL schema (issue 18, docs/postgresql.md): every table of the SQLite schema
 * (server/db/schema.ts, where each table and column is explained) with the same table, column, index
 * and constraint names, used when DATABASE_URL is set. Types by kind: integer → integer (file sizes
 * bigint), real → double precision, epoch-ms timestamps → timestamptz(3), boolean → boolean, JSON
 * text → json, text (and its enums) → text. server/db/schema-parity.spec.ts keeps the two equal;
 * migrations: `npx drizzle-kit generate --config drizzle.pg.config.ts --name <name>` into drizzle-pg/.
 */
import {
  bigint,
  boolean,
  doublePrecision,
  index,
  integer,
  json,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
} from 'drizzle-orm/pg-core';
import { MEMBER_ACCESS, ORDER_STATUSES, PRINT_SET_STATUSES, ROLES, SEWING_STAGES, SHOP_CURRENCIES } from '@seamwright/api';
import type { ListingQuiltPicture, ListingQuiltSize } from '../shop/listing-quilt';
import type { ColourwayCopyFabric } from './schema';

/**
 * A point in time, to the millisecond (precision 3), read and written as a Date: the SQLite schema
 * keeps the same instants as epoch-ms integers in `timestamp_ms` mode, so repository code sees Dates
 * from both.
 */
const instant = (name: string) => timestamp(name, { mode: 'date', withTimezone: true, precision: 3 });

const createdAt = () => instant('created_at').notNull().defaultNow();

/**
 * PostgreSQL only: stored files (print sets, uploads) live in the database, where every instance reads
 * them (server/storage/pg-store.ts). With SQLite they stay in the data folder, so schema.ts has no
 * such tables; the parity spec names them as the only PostgreSQL-only tables.
 */
export { storedFileChunks, storedFiles } from '../storage/pg-file-tables';

export const users = pgTable('users', {
  id: text('id').primaryKey(),
  email: text('email').notNull().unique(),
  displayName: text('display_name').notNull(),
  passwordHash: text('password_hash').notNull(),
  role: text('role', { enum: ROLES }).notNull(),
  disabled: boolean('disabled').notNull().default(false),
  createdAt: createdAt(),
});

export const sessions = pgTable(
  'sessions',
  {
    tokenHash: text('token_hash').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    expiresAt: instant('expires_at').notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);

export const passwordResets = pgTable(
  'password_resets',
  {
    tokenHash: text('token_hash').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
    expiresAt: instant('expires_at').notNull(),
    usedAt: instant('used_at'),
  },
  (t) => [index('password_resets_user_idx').on(t.userId)],
);

export const patterns = pgTable(
  'patterns',
  {
    id: text('id').primaryKey(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    title: text('title').notNull(),
    headRevision: integer('head_revision').notNull(),
    createdAt: createdAt(),
    updatedAt: instant('updated_at').notNull(),
    trashedAt: instant('trashed_at'),
  },
  (t) => [index('patterns_owner_idx').on(t.ownerId)],
);

export const revisions = pgTable(
  'revisions',
  {
    id: text('id').primaryKey(),
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    document: text('document').notNull(),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    restoredFrom: integer('restored_from'),
    editSession: text('edit_session'),
    groupStart: integer('group_start'),
    versionName: text('version_name'),
    versionNote: text('version_note'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('revisions_pattern_number_idx').on(t.patternId, t.number)],
);

export const patternPreviews = pgTable('pattern_previews', {
  patternId: text('pattern_id')
    .primaryKey()
    .references(() => patterns.id, { onDelete: 'cascade' }),
  revisionNumber: integer('revision_number').notNull(),
  rendererVersion: integer('renderer_version').notNull(),
  sectionCount: integer('section_count').notNull(),
  widthIn: doublePrecision('width_in').notNull(),
  heightIn: doublePrecision('height_in').notNull(),
  displayUnit: text('display_unit', { enum: ['in', 'cm'] }).notNull(),
  svg: text('svg'),
});

export const members = pgTable(
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

export const invitations = pgTable(
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
    expiresAt: instant('expires_at').notNull(),
    acceptedAt: instant('accepted_at'),
    acceptedBy: text('accepted_by').references(() => users.id, { onDelete: 'set null' }),
    revokedAt: instant('revoked_at'),
  },
  (t) => [index('invitations_pattern_idx').on(t.patternId)],
);

export const sewingLog = pgTable(
  'sewing_log',
  {
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    sectionId: text('section_id').notNull(),
    copy: integer('copy').notNull().default(1),
    stage: text('stage', { enum: SEWING_STAGES }).notNull(),
    updatedAt: instant('updated_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.patternId, t.userId, t.sectionId, t.copy] })],
);

export const uploads = pgTable(
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
    bytes: bigint('bytes', { mode: 'number' }).notNull(),
    sha256: text('sha256').notNull(),
    storagePath: text('storage_path').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('uploads_pattern_idx').on(t.patternId)],
);

export const printSets = pgTable(
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
    options: text('options').notNull(),
    status: text('status', { enum: PRINT_SET_STATUSES }).notNull(),
    progress: doublePrecision('progress').notNull().default(0),
    error: text('error'),
    sheets: integer('sheets'),
    templateSheets: integer('template_sheets'),
    lowerBoundSheets: integer('lower_bound_sheets'),
    bytes: bigint('bytes', { mode: 'number' }),
    sha256: text('sha256'),
    storagePath: text('storage_path'),
    createdAt: createdAt(),
    finishedAt: instant('finished_at'),
  },
  (t) => [index('print_sets_pattern_idx').on(t.patternId)],
);

export const colourwayCopies = pgTable(
  'colourway_copies',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    sourceColourwayId: text('source_colourway_id'),
    name: text('name').notNull(),
    fabrics: json('fabrics').notNull().$type<Record<string, ColourwayCopyFabric>>(),
    version: integer('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: instant('updated_at').notNull(),
  },
  (t) => [index('colourway_copies_user_pattern_idx').on(t.userId, t.patternId), index('colourway_copies_pattern_idx').on(t.patternId)],
);

export const shops = pgTable('shops', {
  ownerId: text('owner_id')
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  currency: text('currency', { enum: SHOP_CURRENCIES }).notNull(),
  createdAt: createdAt(),
  updatedAt: instant('updated_at').notNull(),
});

export const shopListings = pgTable('shop_listings', {
  patternId: text('pattern_id')
    .primaryKey()
    .references(() => patterns.id, { onDelete: 'cascade' }),
  priceMinor: integer('price_minor').notNull(),
  description: text('description').notNull(),
  publishedAt: instant('published_at'),
  createdAt: createdAt(),
  updatedAt: instant('updated_at').notNull(),
  sectionCount: integer('section_count').notNull().default(0),
  finishedWidthIn: doublePrecision('finished_width_in'),
  finishedHeightIn: doublePrecision('finished_height_in'),
  previewSvg: text('preview_svg'),
  quiltSizes: json('quilt_sizes').$type<ListingQuiltSize[]>(),
  quiltPictures: json('quilt_pictures').$type<ListingQuiltPicture[]>(),
});

export const orders = pgTable(
  'orders',
  {
    id: text('id').primaryKey(),
    buyerId: text('buyer_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    sellerId: text('seller_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    patternId: text('pattern_id').references(() => patterns.id, { onDelete: 'set null' }),
    patternTitle: text('pattern_title').notNull(),
    amountMinor: integer('amount_minor').notNull(),
    currency: text('currency', { enum: SHOP_CURRENCIES }).notNull(),
    status: text('status', { enum: ORDER_STATUSES }).notNull(),
    checkoutSessionId: text('checkout_session_id').unique(),
    paymentIntentId: text('payment_intent_id'),
    refundId: text('refund_id'),
    grantedAccess: boolean('granted_access').notNull().default(false),
    createdAt: createdAt(),
    paidAt: instant('paid_at'),
    refundRequestedAt: instant('refund_requested_at'),
    refundedAt: instant('refunded_at'),
    receiptSentAt: instant('receipt_sent_at'),
  },
  (t) => [
    index('orders_buyer_idx').on(t.buyerId),
    index('orders_seller_idx').on(t.sellerId),
    index('orders_pattern_idx').on(t.patternId),
    index('orders_payment_intent_idx').on(t.paymentIntentId),
  ],
);

export const paymentEvents = pgTable('payment_events', {
  eventId: text('event_id').primaryKey(),
  type: text('type').notNull(),
  receivedAt: instant('received_at').notNull(),
});

export const mailOutbox = pgTable(
  'mail_outbox',
  {
    id: text('id').primaryKey(),
    kind: text('kind').notNull(),
    to: text('to_address').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html'),
    createdAt: createdAt(),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: instant('next_attempt_at').notNull(),
    sentAt: instant('sent_at'),
    failedAt: instant('failed_at'),
    lastError: text('last_error'),
  },
  (t) => [index('mail_outbox_due_idx').on(t.sentAt, t.failedAt, t.nextAttemptAt)],
);

/** Rate-limit counts (schema.ts); `reset_at` in epoch milliseconds, bigint (past 2^31). */
export const rateLimitHits = pgTable(
  'rate_limit_hits',
  {
    key: text('key').primaryKey(),
    hits: integer('hits').notNull(),
    resetAt: bigint('reset_at', { mode: 'number' }).notNull(),
  },
  (t) => [index('rate_limit_hits_reset_idx').on(t.resetAt)],
);
