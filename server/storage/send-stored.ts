import { pipeline } from 'node:stream';
import type { Request, Response } from 'express';
import type { ByteRange, FileStore } from './file-store';

export interface SendOptions {
  contentType: string;
  /** SHA-256 of the stored bytes (hex), from the file's row: the strong ETag, the same on every instance. */
  sha256?: string | null;
}

/**
 * Answers a GET or HEAD with a stored file, the way a static file is served (RFC 9110): Content-Length,
 * ETag and Last-Modified, 304 to a matching If-None-Match / If-Modified-Since, one byte range as 206
 * (several ranges, or an If-Range that no longer matches, get the whole file), 416 for a range past
 * the end. Resolves false, having sent nothing, when there is no file under `key`. Headers the caller
 * set before (Content-Disposition, Cache-Control) are kept.
 */
export async function sendStoredFile(req: Request, res: Response, store: FileStore, key: string, options: SendOptions): Promise<boolean> {
  const stat = await store.stat(key);
  if (!stat) return false;
  const etag = options.sha256 ? `"${options.sha256}"` : `W/"${stat.size.toString(16)}-${stat.modifiedAt.getTime().toString(16)}"`;
  res.setHeader('Content-Type', options.contentType);
  res.setHeader('Accept-Ranges', 'bytes');
  res.setHeader('ETag', etag);
  res.setHeader('Last-Modified', stat.modifiedAt.toUTCString());
  if (req.fresh) {
    res.status(304).end();
    return true;
  }
  let range: ByteRange | undefined;
  if (req.headers.range && rangeStillFresh(req, etag, stat.modifiedAt)) {
    const ranges = req.range(stat.size, { combine: true });
    if (ranges === -1) {
      res.setHeader('Content-Range', `bytes */${stat.size}`);
      res.status(416).json({ error: { status: 416, message: `The range lies outside the file (${stat.size} bytes)` } });
      return true;
    }
    if (Array.isArray(ranges) && ranges.type === 'bytes' && ranges.length === 1) range = { start: ranges[0].start, end: ranges[0].end };
  }
  const length = range ? range.end - range.start + 1 : stat.size;
  if (range) {
    res.status(206);
    res.setHeader('Content-Range', `bytes ${range.start}-${range.end}/${stat.size}`);
  }
  res.setHeader('Content-Length', String(length));
  if (req.method === 'HEAD') {
    res.end();
    return true;
  }
  const body = await store.openRead(key, range);
  if (!body) {
    // Removed between stat and read: nothing was sent yet, and the caller answers 404.
    for (const h of ['Content-Type', 'Accept-Ranges', 'ETag', 'Last-Modified', 'Content-Range', 'Content-Length']) res.removeHeader(h);
    res.status(200);
    return false;
  }
  await new Promise<void>((resolve) => {
    // A client that goes away ends the pipeline and releases the store's stream (a database connection).
    pipeline(body, res, () => resolve());
  });
  return true;
}

/** If-Range (RFC 9110 §13.1.5): the range holds only while the validator still matches. */
function rangeStillFresh(req: Request, etag: string, modifiedAt: Date): boolean {
  const ifRange = req.get('If-Range');
  if (!ifRange) return true;
  if (ifRange.includes('"')) return !etag.startsWith('W/') && ifRange === etag;
  const since = Date.parse(ifRange);
  return !Number.isNaN(since) && Math.floor(modifiedAt.getTime() / 1000) * 1000 <= since;
}
