/*
 * The API's answers and the bodies it takes, as zod schemas with their inferred types (docs/api.md is
 * the human description). The server's tests parse what it sends with these, so a change on one side
 * that the other does not know about fails a test; the app imports the types.
 * Times are ISO 8601 strings. Answers are strict objects: a field the server adds must be added here.
 */
import { z } from 'zod';
import { multiLineText } from './text';
import type { PatternDocument, PatternDocumentInput } from '@seamwright/piecing';
import { MAX_PRICE_MINOR, MIN_PRICE_MINOR, SHOP_CURRENCIES } from './money';
import { MEMBER_ACCESS, ORDER_STATUSES, PRINT_SET_STATUSES, ROLES, SEWING_STAGES } from './constants';
import { idSchema } from './requests';

const isoTime = z.iso.datetime();
const id = idSchema;

/** A stored pattern document (piecing's schema; revisions saved before format 2 keep their version). */
const storedDocument = z.custom<PatternDocument>(
  (v) => typeof v === 'object' && v !== null && !Array.isArray(v) && 'formatVersion' in v,
  'is not a pattern document',
);

// ── Accounts ────────────────────────────────────────────────────────────────────────────────────────

/** Account roles (docs/design-notes.md#roles-and-access). */
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const userSchema = z.strictObject({
  id,
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
  disabled: z.boolean(),
  createdAt: isoTime,
});
export type User = z.infer<typeof userSchema>;

export const personRefSchema = z.strictObject({ id, displayName: z.string(), email: z.string().optional() });
export type PersonRef = z.infer<typeof personRefSchema>;

const csrfToken = z.string().min(1);
export const csrfAnswerSchema = z.strictObject({ csrfToken });
export const signedInAnswerSchema = z.strictObject({ user: userSchema, csrfToken });
export const sessionAnswerSchema = z.strictObject({ user: userSchema.nullable(), csrfToken });
export const userAnswerSchema = z.strictObject({ user: userSchema });
export const okAnswerSchema = z.strictObject({ ok: z.literal(true) });
export const healthAnswerSchema = z.strictObject({ ok: z.literal(true), version: z.string() });

// ── Paging ──────────────────────────────────────────────────────────────────────────────────────────

/** `{ items, total, page, pageSize }` of a list route. */
export function pageSchema<T extends z.ZodType>(item: T) {
  return z.strictObject({
    items: z.array(item),
    total: z.number().int().min(0),
    page: z.number().int().min(1),
    pageSize: z.number().int().min(1).max(100),
  });
}
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export const userPageSchema = pageSchema(userSchema);

// ── Patterns ────────────────────────────────────────────────────────────────────────────────────────

/** A user's access to one pattern. */
export const patternAccessSchema = z.enum(['owner', 'co-designer', 'quilter']);
export type PatternAccess = z.infer<typeof patternAccessSchema>;
/** Access a member can be given (the owner is not a member). */
export const memberAccessSchema = z.enum(MEMBER_ACCESS);
export type MemberAccess = z.infer<typeof memberAccessSchema>;

export const patternSummarySchema = z.strictObject({
  id,
  title: z.string(),
  owner: personRefSchema,
  access: patternAccessSchema,
  headRevision: z.number().int().min(1),
  createdAt: isoTime,
  updatedAt: isoTime,
  trashedAt: isoTime.nullable(),
});
export type PatternSummary = z.infer<typeof patternSummarySchema>;

/** The finished size of a pattern (its drawing area), with the text the list shows in the designer's unit. */
export const finishedSizeSchema = z.strictObject({
  widthIn: z.number().positive(),
  heightIn: z.number().positive(),
  displayUnit: z.enum(['in', 'cm']),
  /** "8 × 8 in.", "25.4 × 20.32 cm". */
  text: z.string(),
});
export type FinishedSize = z.infer<typeof finishedSizeSchema>;

/** One row of the pattern list: the pattern and what the row shows of its latest revision. */
export const patternListItemSchema = patternSummarySchema.extend({
  sectionCount: z.number().int().min(0).nullable(),
  finishedSize: finishedSizeSchema.nullable(),
  /** A small SVG picture drawn by the server (numbers and colours only), or null. */
  preview: z.string().startsWith('<svg').nullable(),
});
export type PatternListItem = z.infer<typeof patternListItemSchema>;
export const patternPageSchema = pageSchema(patternListItemSchema);

export const patternScopeSchema = z.enum(['all', 'owned', 'shared', 'trash']);
export type PatternScope = z.infer<typeof patternScopeSchema>;

/** The pattern list's query as the app builds it (the server fills in defaults). */
export interface PatternListQuery {
  /** 1-based. */
  page: number;
  pageSize: number;
  sort: 'updated' | 'created' | 'title';
  order: 'asc' | 'desc';
  q: string;
  scope: PatternScope;
}

// ── Revisions ───────────────────────────────────────────────────────────────────────────────────────

/** The name and note of a named version. */
export const revisionVersionSchema = z.strictObject({ name: z.string().min(1), note: z.string().nullable() });
export type RevisionVersion = z.infer<typeof revisionVersionSchema>;

export const revisionSummarySchema = z.strictObject({
  id,
  number: z.number().int().min(1),
  author: personRefSchema,
  restoredFrom: z.number().int().min(1).nullable(),
  /** Set when the revision was saved as a named version. */
  version: revisionVersionSchema.nullable(),
  createdAt: isoTime,
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;
export const revisionPageSchema = pageSchema(revisionSummarySchema);

export const revisionSchema = revisionSummarySchema.extend({ document: storedDocument });
export type Revision = z.infer<typeof revisionSchema>;
export const revisionAnswerSchema = z.strictObject({ revision: revisionSchema });

/** One row of History: consecutive saves of one editing session and author (a version or restore is alone). */
export const revisionGroupSchema = z.strictObject({
  first: z.number().int().min(1),
  last: z.number().int().min(1),
  count: z.number().int().min(1),
  author: personRefSchema,
  startedAt: isoTime,
  endedAt: isoTime,
  version: revisionVersionSchema.nullable(),
  restoredFrom: z.number().int().min(1).nullable(),
});
export type RevisionGroup = z.infer<typeof revisionGroupSchema>;
export const revisionGroupPageSchema = pageSchema(revisionGroupSchema);

/** A pattern with its latest revision: the answer of reads and saves. */
export const patternWithRevisionSchema = z.strictObject({ pattern: patternSummarySchema, revision: revisionSchema });
export type PatternWithRevision = z.infer<typeof patternWithRevisionSchema>;
export const patternAnswerSchema = z.strictObject({ pattern: patternSummarySchema });

/** The `details` of a 409 on save: the revision that was saved in between. */
export const staleSaveDetailsSchema = z.strictObject({ latest: revisionSchema });
export type StaleSaveDetails = z.infer<typeof staleSaveDetailsSchema>;

/** Bodies of saves; the document itself is checked by piecing's schema on the server. */
export interface SaveRevisionBody {
  baseRevision: number;
  document: PatternDocumentInput;
  /** The board's editing session: its consecutive saves form one row in History. */
  editSession?: string;
}
/** Saves a named version: `document` when the board holds unsaved changes, else the latest revision's. */
export interface SaveVersionBody {
  baseRevision: number;
  name: string;
  note?: string;
  document?: PatternDocumentInput;
  editSession?: string;
}

// ── Sharing ─────────────────────────────────────────────────────────────────────────────────────────

/** A member; `email` only for the owner and co-designers (docs/api.md, sharing). */
export const memberSchema = z.strictObject({
  userId: id,
  email: z.string().optional(),
  displayName: z.string(),
  access: memberAccessSchema,
  createdAt: isoTime,
});
export type Member = z.infer<typeof memberSchema>;

export const invitationSchema = z.strictObject({
  id,
  email: z.string(),
  access: memberAccessSchema,
  createdAt: isoTime,
  expiresAt: isoTime,
});
export type Invitation = z.infer<typeof invitationSchema>;
export const invitationAnswerSchema = z.strictObject({ invitation: invitationSchema });

export const membersAnswerSchema = z.strictObject({
  owner: z.strictObject({ id, email: z.string().optional(), displayName: z.string() }),
  members: z.array(memberSchema),
  invitations: z.array(invitationSchema),
});
export type MembersResponse = z.infer<typeof membersAnswerSchema>;

/** The answer of changing a member's access: the member without their name and address. */
export const memberChangeAnswerSchema = z.strictObject({
  member: z.strictObject({ userId: id, access: memberAccessSchema, createdAt: isoTime }),
});
export type MemberChange = z.infer<typeof memberChangeAnswerSchema>['member'];

export const invitationPreviewSchema = z.strictObject({
  patternTitle: z.string(),
  invitedBy: z.strictObject({ displayName: z.string() }),
  email: z.string(),
  access: memberAccessSchema,
  expiresAt: isoTime,
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;
export const invitationPreviewAnswerSchema = z.strictObject({ invitation: invitationPreviewSchema });

// ── Sewing log ──────────────────────────────────────────────────────────────────────────────────────

/** Sewing-log stages in the order a quilter reaches them. */
export const sewingStageSchema = z.enum(SEWING_STAGES);
export type SewingStage = z.infer<typeof sewingStageSchema>;

/** The stage one copy of a section has reached (copies count from 1). */
export const sewingLogEntrySchema = z.strictObject({ sectionId: z.string().min(1), copy: z.number().int().min(1), stage: sewingStageSchema, updatedAt: isoTime });
export type SewingLogEntry = z.infer<typeof sewingLogEntrySchema>;
export const sewingLogAnswerSchema = z.strictObject({ entries: z.array(sewingLogEntrySchema) });
export const sewingLogEntryAnswerSchema = z.strictObject({ entry: sewingLogEntrySchema.nullable() });

// ── Uploads ─────────────────────────────────────────────────────────────────────────────────────────

export const uploadSchema = z.strictObject({
  id,
  fileName: z.string(),
  mimeType: z.enum(['image/png', 'image/jpeg', 'image/webp']),
  bytes: z.number().int().min(1),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  createdAt: isoTime,
  url: z.string().startsWith('/api/patterns/'),
});
export type Upload = z.infer<typeof uploadSchema>;
export const uploadAnswerSchema = z.strictObject({ upload: uploadSchema });
export const uploadListAnswerSchema = z.strictObject({ items: z.array(uploadSchema) });

// ── Print sets ──────────────────────────────────────────────────────────────────────────────────────

export const printSetStatusSchema = z.enum(PRINT_SET_STATUSES);
export type PrintSetStatus = z.infer<typeof printSetStatusSchema>;

export const printSetSchema = z.strictObject({
  id,
  patternId: id,
  revision: z.number().int().min(1),
  /** Piecing's print options as the server stored them. */
  options: z.record(z.string(), z.unknown()),
  status: printSetStatusSchema,
  /** 0…1. */
  progress: z.number().min(0).max(1),
  error: z.string().nullable(),
  /** Pages in the PDF (cover, template sheets, cutting list, cautions). */
  sheets: z.number().int().min(1).nullable(),
  /** Sheets carrying templates. */
  templateSheets: z.number().int().min(0).nullable(),
  /** ceil(total template area / printable area). */
  lowerBoundSheets: z.number().int().min(0).nullable(),
  bytes: z.number().int().min(1).nullable(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/).nullable(),
  createdBy: personRefSchema,
  createdAt: isoTime,
  finishedAt: isoTime.nullable(),
  url: z.string().startsWith('/api/patterns/'),
});
export type PrintSet = z.infer<typeof printSetSchema>;
export const printSetAnswerSchema = z.strictObject({ printSet: printSetSchema });
export const printSetListAnswerSchema = z.strictObject({ items: z.array(printSetSchema) });

// ── Admin ───────────────────────────────────────────────────────────────────────────────────────────

export const devMessageSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().optional(),
  date: z.string(),
});
export type DevMessage = z.infer<typeof devMessageSchema>;
export const devInboxAnswerSchema = z.strictObject({ messages: z.array(devMessageSchema) });

// ── Shop ────────────────────────────────────────────────────────────────────────────────────────────

export const shopCurrencySchema = z.enum(SHOP_CURRENCIES);

/** `PUT /api/shop/mine`: the shop's currency. */
export const shopBodySchema = z.strictObject({ currency: shopCurrencySchema });
export type ShopBody = z.infer<typeof shopBodySchema>;

/** `PUT /api/shop/listings/:patternId`: price in minor units, description, published or not. */
export const listingBodySchema = z.strictObject({
  priceMinor: z.number().int().min(MIN_PRICE_MINOR).max(MAX_PRICE_MINOR),
  description: z.string().overwrite(multiLineText).trim().min(1, 'is required').max(2000),
  published: z.boolean(),
});
export type ListingBody = z.infer<typeof listingBodySchema>;

const designerSchema = z.strictObject({ id, displayName: z.string() });

/** A listing as buyers see it. */
export const listingSchema = z.strictObject({
  patternId: id,
  title: z.string(),
  description: z.string(),
  priceMinor: z.number().int().min(0),
  currency: shopCurrencySchema,
  designer: designerSchema,
  published: z.boolean(),
  publishedAt: isoTime.nullable(),
  sectionCount: z.number().int().min(0),
  /** The finished block (the sections' extent, not the drawing area), as of the listing's last save. */
  finishedSize: z.strictObject({ widthIn: z.number(), heightIn: z.number() }).nullable(),
  /** A small SVG picture of the design drawn by the server (numbers and colours only), or null. */
  preview: z.string().startsWith('<svg').nullable(),
  /** The viewer's access to the pattern; null until bought or shared. */
  access: patternAccessSchema.nullable(),
  /**
   * One listing's page only (absent from browse pages): the quilt layout's size chart and a small SVG
   * quilt picture per colourway, the pattern's own fabrics first (colourwayId null), as of the listing's
   * last save; null when the pattern has no quilt layout.
   */
  quilt: z
    .strictObject({
      sizes: z.array(
        z.strictObject({ name: z.string(), widthIn: z.number(), heightIn: z.number(), blockCount: z.number().int().min(0), totalYards: z.number().min(0) }),
      ),
      pictures: z.array(z.strictObject({ colourwayId: z.string().nullable(), name: z.string(), svg: z.string().startsWith('<svg') })),
    })
    .nullable()
    .optional(),
});
export type Listing = z.infer<typeof listingSchema>;
export const listingAnswerSchema = z.strictObject({ listing: listingSchema });
export const listingPageSchema = pageSchema(listingSchema);

export const orderStatusSchema = z.enum(ORDER_STATUSES);
export type OrderStatus = z.infer<typeof orderStatusSchema>;

/** An order as its buyer or seller sees it (`buyer` for the seller, `seller` for the buyer). */
export const orderSchema = z.strictObject({
  id,
  patternId: id.nullable(),
  patternTitle: z.string(),
  amountMinor: z.number().int().min(0),
  currency: shopCurrencySchema,
  status: orderStatusSchema,
  refundRequested: z.boolean(),
  createdAt: isoTime,
  paidAt: isoTime.nullable(),
  refundedAt: isoTime.nullable(),
  receiptSent: z.boolean(),
  buyer: z.strictObject({ id, displayName: z.string(), email: z.string() }).optional(),
  seller: designerSchema.optional(),
});
export type Order = z.infer<typeof orderSchema>;
export const orderAnswerSchema = z.strictObject({ order: orderSchema });
export const checkoutAnswerSchema = z.strictObject({ order: orderSchema, checkoutUrl: z.string().url() });
export const purchasePageSchema = pageSchema(orderSchema);

export const salesPageSchema = pageSchema(orderSchema).extend({
  totals: z.array(z.strictObject({ currency: shopCurrencySchema, orders: z.number().int().min(1), amountMinor: z.number().int() })),
});
export type SalesPage = z.infer<typeof salesPageSchema>;

export const listingSettingsSchema = z.strictObject({
  priceMinor: z.number().int(),
  description: z.string(),
  published: z.boolean(),
  publishedAt: isoTime.nullable(),
  updatedAt: isoTime,
});
export type ListingSettings = z.infer<typeof listingSettingsSchema>;

export const shopAnswerSchema = z.strictObject({ shop: z.strictObject({ currency: shopCurrencySchema }) });

/** The signed-in designer's shop: its currency and every pattern they own. */
export const myShopSchema = z.strictObject({
  shop: z.strictObject({ currency: shopCurrencySchema }).nullable(),
  patterns: z.array(
    z.strictObject({ patternId: id, title: z.string(), paidOrders: z.number().int().min(0), listing: listingSettingsSchema.nullable() }),
  ),
});
export type MyShop = z.infer<typeof myShopSchema>;

// ── Errors ──────────────────────────────────────────────────────────────────────────────────────────

/** Every 4xx/5xx: a message and, for validation errors, the paths that failed. */
export const errorAnswerSchema = z.strictObject({ error: z.string().min(1), details: z.unknown() });
export type ErrorAnswer = z.infer<typeof errorAnswerSchema>;
