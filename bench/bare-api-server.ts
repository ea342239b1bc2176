/**
 * The floor the API benchmark compares Seamwright's server with (bench/api-load.bench.ts): the same
 * three answers — read a pattern, list patterns, save a revision — with the same bytes, from the same
 * SQLite file, written by hand with no framework (`bare`: node:http) or on Express with no middleware
 * (`express`: routes only). It is not a product server: it checks only what the answers need (the
 * session cookie, the caller's access, a CSRF header on writes, the document through the piecing
 * library's own validation) and knows nothing of the other routes.
 *
 *   node --import tsx bench/bare-api-server.ts <bare|express> <database file> <port>
 *
 * Prints `listening <port>` once it listens.
 */
import crypto from 'node:crypto';
import http, { type IncomingMessage, type ServerResponse } from 'node:http';
import Database from 'better-sqlite3';
import express from 'express';
import { formatLength, parsePatternDocument } from '@seamwright/piecing';
import { PREVIEW_RENDERER_VERSION } from '../server/services/pattern-preview';

const [mode = 'bare', file, portText = '0'] = process.argv.slice(2);
if (!file) throw new Error('usage: bare-api-server.ts <bare|express> <database file> <port>');

const sqlite = new Database(file);
sqlite.pragma('journal_mode = WAL');
sqlite.pragma('foreign_keys = ON');
sqlite.pragma('synchronous = NORMAL');
sqlite.pragma('busy_timeout = 5000');

const SESSION_COOKIE = 'seamwright.sid';

interface UserRow {
  id: string;
  role: string;
}
const session = sqlite.prepare<[string, number], UserRow>(
  'SELECT u.id, u.role FROM sessions s JOIN users u ON u.id = s.user_id WHERE s.token_hash = ? AND s.expires_at > ? AND u.disabled = 0',
);

interface ReadRow {
  id: string;
  owner_id: string;
  title: string;
  head_revision: number;
  created_at: number;
  updated_at: number;
  trashed_at: number | null;
  owner_name: string;
  member_access: string | null;
  r_id: string;
  r_number: number;
  r_author_id: string;
  r_author_name: string;
  r_restored_from: number | null;
  r_version_name: string | null;
  r_version_note: string | null;
  r_created_at: number;
  r_document: string;
}
const read = sqlite.prepare<[string, string], ReadRow>(
  `SELECT p.id, p.owner_id, p.title, p.head_revision, p.created_at, p.updated_at, p.trashed_at, o.display_name AS owner_name,
          m.access AS member_access, r.id AS r_id, r.number AS r_number, r.author_id AS r_author_id, a.display_name AS r_author_name,
          r.restored_from AS r_restored_from, r.version_name AS r_version_name, r.version_note AS r_version_note,
          r.created_at AS r_created_at, r.document AS r_document
     FROM patterns p JOIN users o ON o.id = p.owner_id
     LEFT JOIN members m ON m.pattern_id = p.id AND m.user_id = ?
     JOIN revisions r ON r.pattern_id = p.id AND r.number = p.head_revision
     JOIN users a ON a.id = r.author_id
    WHERE p.id = ?`,
);
const accessRow = sqlite.prepare<[string, string], Omit<ReadRow, `r_${string}`>>(
  `SELECT p.id, p.owner_id, p.title, p.head_revision, p.created_at, p.updated_at, p.trashed_at, o.display_name AS owner_name, m.access AS member_access
     FROM patterns p JOIN users o ON o.id = p.owner_id LEFT JOIN members m ON m.pattern_id = p.id AND m.user_id = ? WHERE p.id = ?`,
);
interface HeadRow {
  author_id: string;
  edit_session: string | null;
  version_name: string | null;
  group_start: number | null;
  number: number;
}
const headOf = sqlite.prepare<[string, number], HeadRow>(
  'SELECT number, author_id, edit_session, version_name, group_start FROM revisions WHERE pattern_id = ? AND number = ?',
);
const insertRevision = sqlite.prepare(
  `INSERT INTO revisions (id, pattern_id, number, document, author_id, restored_from, edit_session, group_start, version_name, version_note, created_at)
   VALUES (?, ?, ?, ?, ?, NULL, ?, ?, NULL, NULL, ?)`,
);
const advance = sqlite.prepare('UPDATE patterns SET head_revision = ?, title = ?, updated_at = ? WHERE id = ?');
const displayName = sqlite.prepare<[string], { n: string }>('SELECT display_name AS n FROM users WHERE id = ?');

const listTotal = sqlite.prepare<[string, string], { n: number }>(
  `SELECT count(*) AS n FROM patterns p LEFT JOIN members m ON m.pattern_id = p.id AND m.user_id = ?
    WHERE (p.owner_id = ? OR m.user_id IS NOT NULL) AND p.trashed_at IS NULL`,
);
interface ListRow extends Omit<ReadRow, `r_${string}`> {
  revision_number: number | null;
  section_count: number | null;
  width_in: number | null;
  height_in: number | null;
  display_unit: 'in' | 'cm' | null;
  svg: string | null;
}
const listPage = sqlite.prepare<[string, string, number, number, number], ListRow>(
  `SELECT page.*, v.revision_number, v.section_count, v.width_in, v.height_in, v.display_unit, v.svg FROM (
     SELECT p.id, p.owner_id, p.title, p.head_revision, p.created_at, p.updated_at, p.trashed_at, o.display_name AS owner_name, m.access AS member_access
       FROM patterns p LEFT JOIN members m ON m.pattern_id = p.id AND m.user_id = ? JOIN users o ON o.id = p.owner_id
      WHERE (p.owner_id = ? OR m.user_id IS NOT NULL) AND p.trashed_at IS NULL
      ORDER BY p.updated_at DESC, p.id DESC LIMIT ? OFFSET ?) page
   LEFT JOIN pattern_previews v ON v.pattern_id = page.id AND v.renderer_version = ?
   ORDER BY page.updated_at DESC, page.id DESC`,
);

const iso = (ms: number) => new Date(ms).toISOString();
const patternText = (p: Omit<ReadRow, `r_${string}`>, access: string) =>
  JSON.stringify({
    id: p.id,
    title: p.title,
    owner: { id: p.owner_id, displayName: p.owner_name },
    access,
    headRevision: p.head_revision,
    createdAt: iso(p.created_at),
    updatedAt: iso(p.updated_at),
    trashedAt: p.trashed_at === null ? null : iso(p.trashed_at),
  });

function userOf(cookieHeader: string | undefined): UserRow | undefined {
  if (!cookieHeader) return undefined;
  const at = cookieHeader.indexOf(`${SESSION_COOKIE}=`);
  if (at < 0) return undefined;
  const end = cookieHeader.indexOf(';', at);
  const token = decodeURIComponent(cookieHeader.slice(at + SESSION_COOKIE.length + 1, end < 0 ? undefined : end));
  if (!token || token.length > 100) return undefined;
  return session.get(crypto.createHash('sha256').update(token).digest('hex'), Date.now());
}

type Answer = { status: number; body: string };
const notFound: Answer = { status: 404, body: '{"error":"Pattern not found","details":null}' };

function readPattern(user: UserRow, id: string): Answer {
  const row = read.get(user.id, id);
  const access = row && (row.owner_id === user.id ? 'owner' : row.member_access);
  if (!row || !access || (access !== 'owner' && row.trashed_at !== null)) return notFound;
  const revision = JSON.stringify({
    id: row.r_id,
    number: row.r_number,
    author: { id: row.r_author_id, displayName: row.r_author_name },
    restoredFrom: row.r_restored_from,
    version: row.r_version_name === null ? null : { name: row.r_version_name, note: row.r_version_note },
    createdAt: iso(row.r_created_at),
  });
  return { status: 200, body: `{"pattern":${patternText(row, access)},"revision":${revision.slice(0, -1)},"document":${row.r_document}}}` };
}

const sizeTexts = new Map<string, string>();
function listPatterns(user: UserRow, page: number, pageSize: number): Answer {
  const total = listTotal.get(user.id, user.id)?.n ?? 0;
  const rows = listPage.all(user.id, user.id, pageSize, (page - 1) * pageSize, PREVIEW_RENDERER_VERSION);
  const items = rows.map((r) => {
    const access = r.owner_id === user.id ? 'owner' : r.member_access;
    const preview = r.revision_number === r.head_revision && r.width_in !== null ? r : null;
    let text: string | undefined;
    if (preview) {
      const key = `${preview.width_in} ${preview.height_in} ${preview.display_unit}`;
      text = sizeTexts.get(key);
      if (text === undefined) {
        const unit = preview.display_unit as 'in' | 'cm';
        text = `${formatLength(preview.width_in!, unit, { style: 'unicode', withUnit: false })} × ${formatLength(preview.height_in!, unit, { style: 'unicode' })}`;
        sizeTexts.set(key, text);
      }
    }
    const json = patternText(r, access!);
    const extra = JSON.stringify({
      sectionCount: preview?.section_count ?? null,
      finishedSize: preview ? { widthIn: preview.width_in, heightIn: preview.height_in, displayUnit: preview.display_unit, text } : null,
      preview: preview?.svg ?? null,
    });
    return `${json.slice(0, -1)},${extra.slice(1)}`;
  });
  return { status: 200, body: `{"items":[${items.join(',')}],"total":${total},"page":${page},"pageSize":${pageSize}}` };
}

const saveTx = sqlite.transaction((user: UserRow, id: string, base: number, docText: string, title: string, editSession: string | null): Answer => {
  const row = accessRow.get(user.id, id);
  const access = row && (row.owner_id === user.id ? 'owner' : row.member_access);
  if (!row || !access || (access !== 'owner' && row.trashed_at !== null)) return notFound;
  if (access === 'quilter') return { status: 403, body: '{"error":"Quilter access cannot change this pattern","details":null}' };
  if (row.trashed_at !== null) return { status: 409, body: '{"error":"This pattern is in the trash","details":null}' };
  if (row.head_revision !== base) return { status: 409, body: `{"error":"Saved by someone else","details":{"latest":{"number":${row.head_revision}}}}` };
  const head = headOf.get(id, base);
  const number = base + 1;
  const groupStart =
    !head || editSession === null || head.version_name !== null || head.edit_session !== editSession || head.author_id !== user.id
      ? number
      : (head.group_start ?? head.number);
  const now = Date.now();
  const revisionId = crypto.randomBytes(16).toString('base64url');
  insertRevision.run(revisionId, id, number, docText, user.id, editSession, groupStart, now);
  advance.run(number, title, now, id);
  const authorName = displayName.get(user.id)?.n ?? '';
  const pattern = patternText({ ...row, title, head_revision: number, updated_at: now }, access);
  const revision = JSON.stringify({ id: revisionId, number, author: { id: user.id, displayName: authorName }, restoredFrom: null, version: null, createdAt: iso(now) });
  return { status: 200, body: `{"pattern":${pattern},"revision":${revision.slice(0, -1)},"document":${docText}}}` };
});

function savePattern(user: UserRow, id: string, bodyText: string): Answer {
  let body: { baseRevision?: unknown; document?: unknown; editSession?: unknown };
  try {
    body = JSON.parse(bodyText) as typeof body;
  } catch {
    return { status: 400, body: '{"error":"Invalid JSON","details":null}' };
  }
  if (typeof body.baseRevision !== 'number' || !Number.isInteger(body.baseRevision)) return { status: 400, body: '{"error":"Invalid body","details":null}' };
  const parsed = parsePatternDocument(body.document);
  if (!parsed.ok) return { status: 400, body: '{"error":"The pattern document is not valid","details":null}' };
  const editSession = typeof body.editSession === 'string' ? body.editSession : null;
  return saveTx.immediate(user, id, body.baseRevision, JSON.stringify(parsed.document), parsed.document.title, editSession);
}

const ID = /^[A-Za-z0-9_-]{1,64}$/;

/** Routes one request; `body` is read only for a signed-in PUT with a CSRF header. */
async function answer(method: string, path: string, headers: IncomingMessage['headers'], readBody: () => Promise<string>): Promise<Answer> {
  const user = userOf(headers.cookie);
  if (path === '/api/patterns' || path.startsWith('/api/patterns?')) {
    if (!user) return { status: 401, body: '{"error":"Sign in first","details":null}' };
    return listPatterns(user, 1, 20);
  }
  if (!path.startsWith('/api/patterns/')) return { status: 404, body: '{"error":"Not found","details":null}' };
  const id = path.slice('/api/patterns/'.length);
  if (!user || !ID.test(id)) return notFound;
  if (method === 'GET') return readPattern(user, id);
  if (method === 'PUT') {
    if (typeof headers['x-csrf-token'] !== 'string') return { status: 403, body: '{"error":"Missing or invalid CSRF token","details":null}' };
    return savePattern(user, id, await readBody());
  }
  return { status: 405, body: '{"error":"Method not allowed","details":null}' };
}

function bodyOf(req: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

function send(res: ServerResponse, a: Answer) {
  res.writeHead(a.status, { 'content-type': 'application/json; charset=utf-8', 'content-length': Buffer.byteLength(a.body), 'cache-control': 'no-store' });
  res.end(a.body);
}

const port = Number(portText);
const handler = (req: IncomingMessage, res: ServerResponse) => {
  answer(req.method ?? 'GET', req.url ?? '/', req.headers, () => bodyOf(req)).then(
    (a) => send(res, a),
    () => send(res, { status: 500, body: '{"error":"Failed","details":null}' }),
  );
};

let server: http.Server;
if (mode === 'express') {
  const app = express();
  app.disable('x-powered-by');
  app.disable('etag');
  app.all('/api/patterns{/*rest}', handler);
  server = http.createServer(app);
} else server = http.createServer(handler);
server.keepAliveTimeout = 5000;
server.listen(port, '127.0.0.1', () => {
  const address = server.address();
  console.log(`listening ${typeof address === 'object' && address ? address.port : port}`);
});
process.once('SIGTERM', () => server.close(() => process.exit(0)));
