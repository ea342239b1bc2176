import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { MEMBER_ACCESS, ORDER_STATUSES, PRINT_SET_STATUSES, ROLES, SEWING_STAGES, SHOP_CURRENCIES } from '@seamwright/api';
import type { ListingQuiltPicture, ListingQuiltSize } from '../shop/listing-quilt';

/** Roles, member access, sewing stages and print-set states: the API contract's lists (docs/api.md). */
export { MEMBER_ACCESS, PRINT_SET_STATUSES, ROLES, SEWING_STAGES } from '@seamwright/api';
export type Role = (typeof ROLES)[number];
export type MemberAccess = (typeof MEMBER_ACCESS)[number];
export type SewingStage = (typeof SEWING_STAGES)[number];
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
    /** The editing session (one opening of the board) that sent this save; null for other saves. */
    editSession: text('edit_session'),
    /**
     * Number of the first revision of the run of saves this one belongs to: consecutive saves of one
     * editing session by one author share it, and History shows them as one row. Null (revisions from
     * before grouping) counts as the revision's own number.
     */
    groupStart: integer('group_start'),
    /** Set when the revision was saved as a named version; a version is always a row of its own. */
    versionName: text('version_name'),
    versionNote: text('version_note'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('revisions_pattern_number_idx').on(t.patternId, t.number)],
);

/**
 * What the pattern list shows of a pattern's latest revision, worked out from its document once and
 * kept here: a cache, refilled when the head revision or the preview renderer's version moves on
 * (server/services/pattern-list.ts).
 */
export const patternPreviews = sqliteTable('pattern_previews', {
  patternId: text('pattern_id')
    .primaryKey()
    .references(() => patterns.id, { onDelete: 'cascade' }),
  /** The revision these facts were taken from. */
  revisionNumber: integer('revision_number').notNull(),
  /** Version of the renderer that drew `svg`; an older one is drawn again. */
  rendererVersion: integer('renderer_version').notNull(),
  sectionCount: integer('section_count').notNull(),
  widthIn: real('width_in').notNull(),
  heightIn: real('height_in').notNull(),
  displayUnit: text('display_unit', { enum: ['in', 'cm'] }).notNull(),
  /** A small SVG picture of the pattern; null when it could not be drawn. */
  svg: text('svg'),
});

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

/** Per user and pattern, the stage each copy of a section has reached (docs/api.md). */
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
    /** Which copy of the section (ring repeats × blocks), from 1. */
    copy: integer('copy').notNull().default(1),
    stage: text('stage', { enum: SEWING_STAGES }).notNull(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.patternId, t.userId, t.sectionId, t.copy] })],
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

/** A fabric slot of a quilter's colourway copy: the name and colour they chose, and an optional note. */
export interface ColourwayCopyFabric {
  name: string;
  colour: string;
  note?: string;
}

/**
 * A quilter's own copy of one of a pattern's colourways (design §11, docs/api.md): visible to its owner
 * alone. `fabrics` is keyed by document fabric id; `version` goes up by one on each save, and a save
 * carrying an older one is refused (409).
 */
export const colourwayCopies = sqliteTable(
  'colourway_copies',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    patternId: text('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    /** The colourway it was copied from (null: the pattern's own fabrics); kept if the designer removes it. */
    sourceColourwayId: text('source_colourway_id'),
    name: text('name').notNull(),
    fabrics: text('fabrics', { mode: 'json' }).notNull().$type<Record<string, ColourwayCopyFabric>>(),
    version: integer('version').notNull().default(1),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('colourway_copies_user_pattern_idx').on(t.userId, t.patternId), index('colourway_copies_pattern_idx').on(t.patternId)],
);

export type User = typeof users.$inferSelect;
export type Pattern = typeof patterns.$inferSelect;
export type Revision = typeof revisions.$inferSelect;
export type Member = typeof members.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;
export type Upload = typeof uploads.$inferSelect;
export type PrintSet = typeof printSets.$inferSelect;
export type ColourwayCopy = typeof colourwayCopies.$inferSelect;

// ---- Pattern shop (issue 9) ----

/** Currencies a shop may sell in: one list for the server and the app, in the API contract. */
export { SHOP_CURRENCIES, type ShopCurrency } from '@seamwright/api';

export { ORDER_STATUSES } from '@seamwright/api';
export type OrderStatus = (typeof ORDER_STATUSES)[number];

/** A designer's shop: one currency for every listing in it. */
export const shops = sqliteTable('shops', {
  ownerId: text('owner_id')
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  currency: text('currency', { enum: SHOP_CURRENCIES }).notNull(),
  createdAt: createdAt(),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
});

/** A pattern offered in its owner's shop; the price is in minor units of the shop's currency. */
export const shopListings = sqliteTable('shop_listings', {
  patternId: text('pattern_id')
    .primaryKey()
    .references(() => patterns.id, { onDelete: 'cascade' }),
  priceMinor: integer('price_minor').notNull(),
  description: text('description').notNull(),
  /** Set while the listing is published; null when withdrawn or never published. */
  publishedAt: integer('published_at', { mode: 'timestamp_ms' }),
  createdAt: createdAt(),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
  /**
   * What the shop shows of the design, written from the head revision whenever the listing is saved
   * (so browsing never reads documents): sections, the finished block size (null: no sections) and a
   * small SVG picture drawn by the server (null: none yet, as for listings saved before these columns).
   */
  sectionCount: integer('section_count').notNull().default(0),
  finishedWidthIn: real('finished_width_in'),
  finishedHeightIn: real('finished_height_in'),
  previewSvg: text('preview_svg'),
  /**
   * The quilt layout's size chart and one small SVG quilt picture per colourway (the pattern's own
   * fabrics first), written with the facts above (design §11); null when the pattern has no quilt.
   */
  quiltSizes: text('quilt_sizes', { mode: 'json' }).$type<ListingQuiltSize[]>(),
  quiltPictures: text('quilt_pictures', { mode: 'json' }).$type<ListingQuiltPicture[]>(),
});

/** One purchase of a pattern: a checkout session at the payment provider and what came of it. */
export const orders = sqliteTable(
  'orders',
  {
    id: text('id').primaryKey(),
    buyerId: text('buyer_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    sellerId: text('seller_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    /** Null once the pattern is deleted for good; the title stays for the records. */
    patternId: text('pattern_id').references(() => patterns.id, { onDelete: 'set null' }),
    patternTitle: text('pattern_title').notNull(),
    amountMinor: integer('amount_minor').notNull(),
    currency: text('currency', { enum: SHOP_CURRENCIES }).notNull(),
    status: text('status', { enum: ORDER_STATUSES }).notNull(),
    checkoutSessionId: text('checkout_session_id').unique(),
    paymentIntentId: text('payment_intent_id'),
    refundId: text('refund_id'),
    /** Whether paying this order added the buyer as a quilter (so a refund takes only that away). */
    grantedAccess: integer('granted_access', { mode: 'boolean' }).notNull().default(false),
    createdAt: createdAt(),
    paidAt: integer('paid_at', { mode: 'timestamp_ms' }),
    refundRequestedAt: integer('refund_requested_at', { mode: 'timestamp_ms' }),
    refundedAt: integer('refunded_at', { mode: 'timestamp_ms' }),
    receiptSentAt: integer('receipt_sent_at', { mode: 'timestamp_ms' }),
  },
  (t) => [
    index('orders_buyer_idx').on(t.buyerId),
    index('orders_seller_idx').on(t.sellerId),
    index('orders_pattern_idx').on(t.patternId),
    index('orders_payment_intent_idx').on(t.paymentIntentId),
  ],
);

/** Payment-provider webhook events already handled (each is acted on once). */
export const paymentEvents = sqliteTable('payment_events', {
  eventId: text('event_id').primaryKey(),
  type: text('type').notNull(),
  receivedAt: integer('received_at', { mode: 'timestamp_ms' }).notNull(),
});

/**
 * Outgoing e-mail, written in the same request that decides to send it and delivered by the
 * background sender (server/services/mail-outbox.ts) with retries; a request never waits for mail.
 * The body is cleared once sent, so no reset or invitation link stays in the table.
 */
export const mailOutbox = sqliteTable(
  'mail_outbox',
  {
    id: text('id').primaryKey(),
    /** What the mail is (password-reset, invitation, receipt), for the log. */
    kind: text('kind').notNull(),
    to: text('to_address').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html'),
    createdAt: createdAt(),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: integer('next_attempt_at', { mode: 'timestamp_ms' }).notNull(),
    sentAt: integer('sent_at', { mode: 'timestamp_ms' }),
    /** Set when the sender gave up after its last attempt. */
    failedAt: integer('failed_at', { mode: 'timestamp_ms' }),
    lastError: text('last_error'),
  },
  (t) => [index('mail_outbox_due_idx').on(t.sentAt, t.failedAt, t.nextAttemptAt)],
);

/**
 * Rate-limit counts (sign-in, sign-up, password reset: server/auth/rate-limit-store.ts), kept in the
 * database so every instance on one database counts together. `key` is the limiter's prefix and the
 * client's key; `reset_at` is when the window ends, in epoch milliseconds (a plain integer, so one SQL
 * statement compares it on SQLite and PostgreSQL alike). Expired rows are swept (`reset_at` index).
 */
export const rateLimitHits = sqliteTable(
  'rate_limit_hits',
  {
    key: text('key').primaryKey(),
    hits: integer('hits').notNull(),
    resetAt: integer('reset_at').notNull(),
  },
  (t) => [index('rate_limit_hits_reset_idx').on(t.resetAt)],
);

export type Shop = typeof shops.$inferSelect;
export type ShopListing = typeof shopListings.$inferSelect;
export type Order = typeof orders.$inferSelect;
