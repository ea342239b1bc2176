import type { Response } from 'express';

/**
 * Sends JSON text that is already written (a stored document spliced into its answer) as it is:
 * one write of the string, no Buffer copy and no ETag hash of the body (res.send does both; API
 * answers carry Cache-Control: no-store, so a validator would never be used). Headers set before
 * (security headers, Cache-Control, cookies) go out with it.
 */
export function sendJsonText(res: Response, status: number, text: string): void {
  res.statusCode = status;
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.setHeader('Content-Length', Buffer.byteLength(text));
  res.end(text);
}
