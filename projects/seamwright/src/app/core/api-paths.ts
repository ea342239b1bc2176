/*
 * Every API address the app calls, in one place (see docs/api.md).
 */
const p = (id: string) => `/api/patterns/${encodeURIComponent(id)}`;

/** Header that carries the CSRF token on state-changing requests. */
export const CSRF_HEADER = 'x-csrf-token';

export const API = {
  csrf: '/api/auth/csrf',
  changePassword: '/api/auth/change-password',
  me: '/api/auth/me',
  /** Who is signed in, or null, with a CSRF token: answered 200 either way (no 401 in the console). */
  session: '/api/auth/session',
  signIn: '/api/auth/sign-in',
  signUp: '/api/auth/sign-up',
  signOut: '/api/auth/sign-out',
  resetRequest: '/api/auth/password-reset',
  resetConfirm: '/api/auth/password-reset/confirm',
  patterns: '/api/patterns',
  pattern: p,
  duplicate: (id: string) => `${p(id)}/duplicate`,
  trash: (id: string) => `${p(id)}/trash`,
  restore: (id: string) => `${p(id)}/restore`,
  revisions: (id: string) => `${p(id)}/revisions`,
  revision: (id: string, n: number) => `${p(id)}/revisions/${n}`,
  revisionGroups: (id: string) => `${p(id)}/revisions/groups`,
  restoreRevision: (id: string, n: number) => `${p(id)}/revisions/${n}/restore`,
  members: (id: string) => `${p(id)}/members`,
  member: (id: string, userId: string) => `${p(id)}/members/${encodeURIComponent(userId)}`,
  invitations: (id: string) => `${p(id)}/invitations`,
  invitation: (id: string, invitationId: string) => `${p(id)}/invitations/${encodeURIComponent(invitationId)}`,
  invitationByToken: (token: string) => `/api/invitations/${encodeURIComponent(token)}`,
  acceptInvitation: '/api/invitations/accept',
  sewingLog: (id: string) => `${p(id)}/sewing-log`,
  sewingLogSection: (id: string, sectionId: string) => `${p(id)}/sewing-log/${encodeURIComponent(sectionId)}`,
  uploads: (id: string) => `${p(id)}/uploads`,
  uploadFile: (id: string, uploadId: string) => `${p(id)}/uploads/${encodeURIComponent(uploadId)}/file`,
  printSets: (id: string) => `${p(id)}/print-sets`,
  printSet: (id: string, setId: string) => `${p(id)}/print-sets/${encodeURIComponent(setId)}`,
  printSetFile: (id: string, setId: string) => `${p(id)}/print-sets/${encodeURIComponent(setId)}/file`,
  printSetEvents: (id: string, setId: string) => `${p(id)}/print-sets/${encodeURIComponent(setId)}/events`,
  adminUsers: '/api/admin/users',
  adminUser: (userId: string) => `/api/admin/users/${encodeURIComponent(userId)}`,
  devInbox: '/api/admin/dev-inbox',
  health: '/api/health',
} as const;
