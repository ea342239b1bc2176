import { randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import net from 'node:net';
import { gzipSync } from 'node:zlib';
import express, { type ErrorRequestHandler } from 'express';
import { describe, expect, it } from 'vitest';
import { DocumentBytes, jsonBodies, jsonDepthExceeds, largeDocumentBody } from './json-bodies';

const bytes = (s: string) => Buffer.from(s, 'utf8');

describe('jsonDepthExceeds', () => {
  it('counts arrays and objects together, just inside and just past the limit', () => {
    expect(jsonDepthExceeds(bytes('[[[1]]]'), 3)).toBe(false);
    expect(jsonDepthExceeds(bytes('[[[[1]]]]'), 3)).toBe(true);
    expect(jsonDepthExceeds(bytes('{"a":[{"b":[]}]}'), 4)).toBe(false);
    expect(jsonDepthExceeds(bytes('{"a":[{"b":[{}]}]}'), 4)).toBe(true);
  });

  it('siblings do not add up: depth returns when a bracket closes', () => {
    expect(jsonDepthExceeds(bytes(`[${'[1],'.repeat(10_000)}[1]]`), 2)).toBe(false);
  });

  it('ignores brackets inside strings, also after escaped quotes and backslashes', () => {
    expect(jsonDepthExceeds(bytes(`["${'['.repeat(100)}"]`), 1)).toBe(false);
    expect(jsonDepthExceeds(bytes(`["a\\"[[[[", "\\\\", "{{{"]`), 1)).toBe(false);
    // After an escaped backslash the quote really closes the string, so the brackets after it count.
    expect(jsonDepthExceeds(bytes(`["\\\\",[[[]]]]`), 3)).toBe(true);
  });

  it('reads multi-byte UTF-8 text without miscounting', () => {
    expect(jsonDepthExceeds(bytes('{"title":"キルト ☂ [ 🧵 ]","x":[1]}'), 2)).toBe(false);
  });

  it('stops at once on the issue body of 4.9 MB of "["', () => {
    expect(jsonDepthExceeds(bytes('['.repeat(4_900_000)), 64)).toBe(true);
  });
});

describe('jsonBodies: large document bodies', () => {
  /** An app with the body readers in front of one document route that tells what it got. */
  async function withApp(run: (base: string, seen: Array<{ kind: string; bytes?: Buffer; status?: number }>) => Promise<void>) {
    const seen: Array<{ kind: string; bytes?: Buffer; status?: number }> = [];
    const app = express();
    app.use((req, _res, next) => {
      (req as unknown as { user: object }).user = { id: 'u' };
      next();
    });
    app.use(jsonBodies('1mb'));
    app.put('/patterns/:id', (req, res) => {
      const kind = req.body instanceof DocumentBytes ? 'chunks' : Buffer.isBuffer(req.body) ? 'buffer' : typeof req.body;
      const chunks = largeDocumentBody(req.body);
      seen.push({ kind, bytes: chunks ? Buffer.concat(chunks) : undefined });
      res.json({ kind });
    });
    app.use(((err, _req, res, _next) => {
      const status = (err as { status?: number }).status ?? 500;
      seen.push({ kind: 'error', status });
      res.status(status).json({ error: String(err) });
    }) as ErrorRequestHandler);
    const server = app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    try {
      await run(`http://127.0.0.1:${(server.address() as AddressInfo).port}`, seen);
    } finally {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
    }
  }
  // Hex of random bytes: still over 64 kB (INLINE_DOCUMENT_BYTES) once gzipped, so it goes the large bodies' way.
  const body = Buffer.from(JSON.stringify({ baseRevision: 1, document: { title: 'Large', padding: randomBytes(150_000).toString('hex'), note: 'キルト 🧵' } }), 'utf8');

  it('hands a plain UTF-8 body of known length to the route as its chunks, byte for byte', async () => {
    await withApp(async (base, seen) => {
      const res = await fetch(`${base}/patterns/p1`, { method: 'PUT', headers: { 'Content-Type': 'application/json; charset=utf-8' }, body });
      expect(res.status).toBe(200);
      expect(seen).toHaveLength(1);
      expect(seen[0].kind).toBe('chunks');
      expect(seen[0].bytes!.equals(body)).toBe(true);
    });
  });

  it('leaves a compressed or chunked body, and one over the limit, to express.raw', async () => {
    await withApp(async (base, seen) => {
      const gz = await fetch(`${base}/patterns/p1`, { method: 'PUT', headers: { 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' }, body: gzipSync(body) });
      expect(gz.status).toBe(200);
      expect(seen[0].kind).toBe('buffer');
      expect(seen[0].bytes!.equals(body)).toBe(true);
      // A stream body goes without Content-Length (Transfer-Encoding: chunked).
      const stream = new ReadableStream({
        start(c) {
          c.enqueue(body.subarray(0, 1000));
          c.enqueue(body.subarray(1000));
          c.close();
        },
      });
      const chunked = await fetch(`${base}/patterns/p1`, { method: 'PUT', headers: { 'Content-Type': 'application/json' }, body: stream, duplex: 'half' } as RequestInit);
      expect(chunked.status).toBe(200);
      expect(seen[1].kind).toBe('buffer');
      expect(seen[1].bytes!.equals(body)).toBe(true);
      const huge = await fetch(`${base}/patterns/p1`, { method: 'PUT', headers: { 'Content-Type': 'application/json' }, body: Buffer.alloc(1024 * 1024 + 1, 0x20) });
      expect(huge.status).toBe(413);
      expect(seen[2]).toEqual({ kind: 'error', status: 413 });
    });
  });

  it('answers 400, never the route, when the client stops before the stated length', async () => {
    await withApp(async (base, seen) => {
      const { port } = new URL(base);
      const socket = net.connect(Number(port), '127.0.0.1');
      await new Promise((r) => socket.once('connect', r));
      socket.write(`PUT /patterns/p1 HTTP/1.1\r\nHost: x\r\nContent-Type: application/json\r\nContent-Length: ${body.length}\r\n\r\n`);
      socket.write(body.subarray(0, 100_000));
      await new Promise((r) => setTimeout(r, 50));
      socket.destroy();
      await expect.poll(() => seen.length).toBe(1);
      expect(seen[0]).toEqual({ kind: 'error', status: 400 });
    });
  });
});
