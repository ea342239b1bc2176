/*
 * Value lists the database, the server and the app share (docs/api.md). The database schema takes its
 * column enums from here, so a value cannot be stored that the API does not describe.
 */

/** Account roles (docs/design-notes.md#roles-and-access). */
export const ROLES = ['admin', 'designer', 'quilter'] as const;

/** Access a member has to one pattern; the owner is not a member. */
export const MEMBER_ACCESS = ['co-designer', 'quilter'] as const;

/** Sewing-log stages of one copy of a section, in the order a quilter reaches them (docs/api.md#sewing-log-per-user-per-pattern). */
export const SEWING_STAGES = ['pieced', 'trimmed', 'joined'] as const;

/** A print set's life: waiting, being drawn, finished or given up. */
export const PRINT_SET_STATUSES = ['queued', 'rendering', 'done', 'failed'] as const;

/** A shop order's life: checkout open, paid, paid back, checkout lapsed. */
export const ORDER_STATUSES = ['pending', 'paid', 'refunded', 'expired'] as const;
