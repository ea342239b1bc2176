/**
 * A small world of data for the hostile-input and session tests: an owner with a pattern (two
 * revisions), an accepted co-designer, a pending invitation, a sewing-log entry and a reference
 * image; plus helpers that check an answer is well-formed (2xx/4xx, JSON `{ error, details }` on 4xx).
 */
import { expect } from 'vitest';
import { ApiClient, signedInClient, type ApiResponse, type Credentials } from './api-client';
import { gridDocument } from './documents';
import type { ServerProcess } from './server-process';

/** A valid 1 × 1 PNG (signature, IHDR, IDAT, IEND; PNG specification, ISO/IEC 15948). */
export const TINY_PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAQAAAC1HAwCAAAAC0lEQVR42mNkYAAAAAYAAjCB0C8AAAAASUVORK5CYII=',
  'base64',
);

export interface World {
  owner: ApiClient;
  ownerCredentials: Credentials;
  partner: ApiClient;
  partnerCredentials: Credentials;
  patternId: string;
  /** Section ids of the pattern's latest revision. */
  sectionIds: string[];
  uploadId: string;
  invitationId: string;
  invitationToken: string;
  /** A finished print set of the pattern. */
  printSetId: string;
}

/** Uploads `bytes` as the multipart field `file`. */
export function uploadForm(bytes: Uint8Array, fileName = 'reference.png', type = 'image/png', field = 'file'): FormData {
  const form = new FormData();
  form.append(field, new Blob([new Uint8Array(bytes)], { type }), fileName);
  return form;
}

/** Builds the world on a running server. */
export async function buildWorld(server: ServerProcess, label = 'world'): Promise<World> {
  const { client: owner, credentials: ownerCredentials } = await signedInClient(server.baseUrl, 'designer', `${label}-owner`);
  const { client: partner, credentials: partnerCredentials } = await signedInClient(server.baseUrl, 'designer', `${label}-partner`);
  const doc = gridDocument(`${label} pattern`, 2, 2, 2);
  const created = await owner.post('/api/patterns', { document: doc });
  expect(created.status, created.text).toBe(201);
  const patternId: string = created.json.pattern.id;
  const saved = await owner.put(`/api/patterns/${patternId}`, { baseRevision: 1, document: gridDocument(`${label} pattern`, 2, 2, 2) });
  expect(saved.status, saved.text).toBe(200);
  const sectionIds: string[] = saved.json.revision.document.sections.map((s: { id: string }) => s.id);

  const mail = server.mail.waitFor(partnerCredentials.email, 15_000);
  const invited = await owner.post(`/api/patterns/${patternId}/invitations`, { email: partnerCredentials.email, access: 'co-designer' });
  expect(invited.status, invited.text).toBe(201);
  const token = decodeURIComponent(/[?&]token=([^&\s"'<>]+)/.exec((await mail).text)?.[1] ?? '');
  const accepted = await partner.post('/api/invitations/accept', { token });
  expect(accepted.status, accepted.text).toBe(200);

  // A second, pending invitation (to an address nobody has).
  const pendingMail = server.mail.waitFor(`pending-${label}@faults.example`, 15_000);
  const pending = await owner.post(`/api/patterns/${patternId}/invitations`, { email: `pending-${label}@faults.example`, access: 'quilter' });
  expect(pending.status, pending.text).toBe(201);
  const invitationToken = decodeURIComponent(/[?&]token=([^&\s"'<>]+)/.exec((await pendingMail).text)?.[1] ?? '');

  const log = await owner.put(`/api/patterns/${patternId}/sewing-log/${sectionIds[0]}`, { stage: 'pieced' });
  expect(log.status, log.text).toBe(200);
  const up = await owner.request('POST', `/api/patterns/${patternId}/uploads`, { body: uploadForm(TINY_PNG) });
  expect(up.status, up.text).toBe(201);
  const printed = await owner.post(`/api/patterns/${patternId}/print-sets`, { options: { copies: 'single' } });
  expect(printed.status, printed.text).toBe(202);
  const printSetId: string = printed.json.printSet.id;
  for (let i = 0; i < 600; i++) {
    const s = await owner.get(`/api/patterns/${patternId}/print-sets/${printSetId}`);
    if (s.json.printSet.status === 'done') break;
    if (s.json.printSet.status === 'failed') throw new Error(`world print set failed: ${s.json.printSet.error}`);
    if (i === 599) throw new Error('world print set did not finish within 60 s');
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    printSetId,
    owner,
    ownerCredentials,
    partner,
    partnerCredentials,
    patternId,
    sectionIds,
    uploadId: up.json.upload.id,
    invitationId: pending.json.invitation.id,
    invitationToken,
  };
}

/** Whether an answer is well-formed: never 5xx; every 4xx is JSON `{ error: string, details }`. */
export function answerProblem(res: ApiResponse): string | undefined {
  if (res.status >= 500) return `answered ${res.status}: ${res.text.slice(0, 300)}`;
  if (res.status < 200 || (res.status >= 300 && res.status < 400 && res.status !== 304)) return `answered ${res.status}`;
  if (res.status >= 400) {
    if (!res.contentType.includes('application/json')) return `4xx without JSON (${res.contentType}): ${res.text.slice(0, 200)}`;
    if (!res.json || typeof res.json.error !== 'string' || res.json.error.length === 0) return `4xx without an error message: ${res.text.slice(0, 200)}`;
    if (!('details' in res.json)) return `4xx without details: ${res.text.slice(0, 200)}`;
    if (/\bat [\w$.<>]+ \(|node_modules|\.ts:\d+/.test(res.text)) return `4xx leaks a stack trace: ${res.text.slice(0, 300)}`;
  }
  return undefined;
}

/** Asserts an answer is well-formed (see {@link answerProblem}). */
export function expectCleanAnswer(res: ApiResponse, what: string): void {
  const problem = answerProblem(res);
  expect(problem, `${what}: ${problem}`).toBeUndefined();
}
