/*
 * Shapes of the API's answers (docs/api.md). Times are ISO 8601 strings.
 */
import type { PatternDocument, PatternDocumentInput } from '@seamwright/piecing';

/** Account roles (docs/design-notes.md#roles-and-access). */
export type Role = 'admin' | 'designer' | 'quilter';
/** A user's access to one pattern. */
export type PatternAccess = 'owner' | 'co-designer' | 'quilter';
/** Access a member can be given (the owner is not a member). */
export type MemberAccess = 'co-designer' | 'quilter';
/** Sewing-log stages in the order a quilter reaches them. */
export type SewingStage = 'cut' | 'sewn' | 'trimmed';
export const SEWING_STAGES: readonly SewingStage[] = ['cut', 'sewn', 'trimmed'];

export interface User {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  disabled: boolean;
  createdAt: string;
}

export interface PersonRef {
  id: string;
  displayName: string;
  email?: string;
}

/** One row of the pattern list. */
export interface PatternSummary {
  id: string;
  title: string;
  owner: PersonRef;
  access: PatternAccess;
  headRevision: number;
  createdAt: string;
  updatedAt: string;
  trashedAt: string | null;
}

/** The finished size of a pattern (its drawing area), with the text the list shows in the designer's unit. */
export interface FinishedSize {
  widthIn: number;
  heightIn: number;
  displayUnit: 'in' | 'cm';
  /** "8 × 8 in.", "25.4 × 20.32 cm". */
  text: string;
}

/** One row of the pattern list: the pattern and what the row shows of its latest revision (docs/api.md). */
export interface PatternListItem extends PatternSummary {
  sectionCount: number | null;
  finishedSize: FinishedSize | null;
  /** A small SVG picture drawn by the server (numbers and colours only), or null. */
  preview: string | null;
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export type PatternScope = 'all' | 'owned' | 'shared' | 'trash';

export interface PatternListQuery {
  /** 1-based. */
  page: number;
  pageSize: number;
  sort: 'updated' | 'created' | 'title';
  order: 'asc' | 'desc';
  q: string;
  scope: PatternScope;
}

export interface RevisionSummary {
  id: string;
  number: number;
  author: PersonRef;
  restoredFrom: number | null;
  /** Set when the revision was saved as a named version. */
  version: RevisionVersion | null;
  createdAt: string;
}

/** The name and note of a named version. */
export interface RevisionVersion {
  name: string;
  note: string | null;
}

/** One row of History: consecutive saves of one editing session and author (a version or restore is alone). */
export interface RevisionGroup {
  first: number;
  last: number;
  count: number;
  author: PersonRef;
  startedAt: string;
  endedAt: string;
  version: RevisionVersion | null;
  restoredFrom: number | null;
}

/** Saves a named version: `document` when the board holds unsaved changes, else the latest revision's. */
export interface SaveVersionBody {
  baseRevision: number;
  name: string;
  note?: string;
  document?: PatternDocumentInput;
  editSession?: string;
}

export interface Revision extends RevisionSummary {
  document: PatternDocument;
}

/** A pattern with its latest revision. */
export interface PatternWithRevision {
  pattern: PatternSummary;
  revision: Revision;
}

export interface SaveRevisionBody {
  baseRevision: number;
  document: PatternDocumentInput;
  /** The board's editing session: its consecutive saves form one row in History. */
  editSession?: string;
}

/** The `details` of a 409 on save: the revision that was saved in between. */
export interface StaleSaveDetails {
  latest: Revision;
}

export interface Member {
  userId: string;
  email: string;
  displayName: string;
  access: MemberAccess;
  createdAt: string;
}

export interface Invitation {
  id: string;
  email: string;
  access: MemberAccess;
  createdAt: string;
  expiresAt: string;
}

export interface MembersResponse {
  owner: PersonRef & { email: string };
  members: Member[];
  invitations: Invitation[];
}

export interface InvitationPreview {
  patternTitle: string;
  invitedBy: { displayName: string };
  email: string;
  access: MemberAccess;
  expiresAt: string;
}

export interface SewingLogEntry {
  sectionId: string;
  stage: SewingStage;
  updatedAt: string;
}

export type PrintSetStatus = 'queued' | 'rendering' | 'done' | 'failed';

export interface PrintSet {
  id: string;
  patternId: string;
  revision: number;
  options: Record<string, unknown>;
  status: PrintSetStatus;
  /** 0…1. */
  progress: number;
  error: string | null;
  sheets: number | null;
  lowerBoundSheets: number | null;
  bytes: number | null;
  sha256: string | null;
  createdBy: PersonRef;
  createdAt: string;
  finishedAt: string | null;
  url: string;
}

export interface DevMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html?: string;
  date: string;
}
