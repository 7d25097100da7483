import 'server-only';
import { z, type ZodType } from 'zod';
import { AppError } from '@/lib/errors';
import { parseOrThrow } from './parse-input';

/** A JSON request body, at most `maxBytes` long: 415 for another content type, 400 for bad JSON. */
export async function readJsonBody(req: Request, maxBytes: number): Promise<unknown> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^application\/json\b/i.test(type)) {
    throw new AppError('unsupported_media_type', 'Send the request body as JSON (Content-Type: application/json).');
  }
  const text = await req.text();
  if (Buffer.byteLength(text) > maxBytes)
    throw new AppError('payload_too_large', `The request body is larger than ${Math.round(maxBytes / 1024)} KB.`);
  if (!text.trim()) throw new AppError('invalid_json', 'The request body is empty; JSON was expected.');
  try {
    return JSON.parse(text) as unknown;
  } catch {
    throw new AppError('invalid_json', 'The request body is not valid JSON.');
  }
}

/**
 * Fields a JSON body carries that its schema does not know. zod would drop them silently; we
 * refuse them instead, so that a client never believes it set something that was not stored.
 */
function findUnknownFields(schema: ZodType, value: unknown): string[] {
  if (!(schema instanceof z.ZodObject) || schema._zod.def.catchall) return [];
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return [];
  const known = new Set(Object.keys(schema.shape));
  return Object.keys(value).filter((k) => !known.has(k));
}

/** A parsed JSON body checked against its schema: 422 for an unknown field or a failing one. */
export function parseBodyOrThrow<T>(schema: ZodType<T>, value: unknown): T {
  const extra = findUnknownFields(schema, value);
  if (extra.length) {
    const shown = extra
      .slice(0, 5)
      .map((k) => `“${k.slice(0, 40)}”`)
      .join(', ');
    throw new AppError(
      'invalid_body',
      `Request: ${extra.length === 1 ? 'this field is' : 'these fields are'} not part of this request: ${shown}.`,
      Object.fromEntries(extra.slice(0, 20).map((k) => [k.slice(0, 40), ['is not a field of this request']])),
    );
  }
  return parseOrThrow(schema, value, 'Request');
}

/** An upload's raw bytes, at most `maxBytes`: 413 when larger, 422 when empty or cut off mid-stream. */
export async function readBodyBytes(req: Request, maxBytes: number): Promise<Uint8Array> {
  const declared = Number(req.headers.get('content-length') ?? 0);
  const limit =
    maxBytes >= 1024 * 1024 ? `${Math.round(maxBytes / (1024 * 1024))} MB` : `${Math.round(maxBytes / 1024)} KB`;
  if (declared > maxBytes) throw new AppError('payload_too_large', `The file is larger than ${limit}.`);
  if (!req.body) throw new AppError('invalid_body', 'The upload is empty.');
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    let chunk: ReadableStreamReadResult<Uint8Array>;
    try {
      chunk = await reader.read();
    } catch {
      // The connection dropped mid-upload: nothing was stored, and the device sends it again.
      throw new AppError(
        'invalid_body',
        'The upload was cut off before it finished. Nothing was saved; send the photo again.',
      );
    }
    const { done, value } = chunk;
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel();
      throw new AppError('payload_too_large', `The file is larger than ${limit}.`);
    }
    chunks.push(value);
  }
  if (size === 0) throw new AppError('invalid_body', 'The upload is empty.');
  const out = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}
