import "server-only";
import { AppError, type ErrorCode } from "./errors";
import { BODY_TOO_LARGE, DOCUMENT_MAX_BYTES, DOCUMENT_TOO_LARGE, ENVELOPE_BYTES, JSON_BODY_MAX_BYTES, REFERENCE_MAX_BYTES, REFERENCE_TOO_LARGE } from "./size-limits";

/** How much of a request body a route reads, and what it answers beyond that. */
export interface BodyLimit {
  maxBytes: number;
  code: ErrorCode;
  message: string;
}

export const JSON_BODY_LIMIT: BodyLimit = { maxBytes: JSON_BODY_MAX_BYTES, code: "too-large:body", message: BODY_TOO_LARGE };
/** Bodies that carry a model document: the document's limit plus room for the fields beside it. */
export const DOCUMENT_BODY_LIMIT: BodyLimit = { maxBytes: DOCUMENT_MAX_BYTES + ENVELOPE_BYTES, code: "too-large:document", message: DOCUMENT_TOO_LARGE };
/**
 * Bodies that carry a reference file as a JSON string: escaping (a newline is two characters) adds a few per cent
 * to a CSV, so the file's own limit is checked again, exactly, after parsing.
 */
export const REFERENCE_BODY_LIMIT: BodyLimit = { maxBytes: Math.ceil(REFERENCE_MAX_BYTES * 1.25) + ENVELOPE_BYTES, code: "too-large:reference", message: REFERENCE_TOO_LARGE };

/**
 * A streamed body found too large is still read to its end, and dropped, up to this many times the limit: a sender
 * that is still writing then gets the answer rather than a connection reset. Beyond that the connection is cut.
 */
const DRAIN_FACTOR = 4;

/**
 * The body as text, refused as soon as it is known to be too large: by its Content-Length before anything is read,
 * and by counting while it streams in (a sender may leave the length out, or state it falsely). Nothing beyond the
 * limit is kept.
 */
export async function readBodyText(request: Request, limit: BodyLimit): Promise<string> {
  const tooLarge = () => new AppError(limit.code, limit.message, undefined, { limitBytes: limit.maxBytes });
  const declared = Number(request.headers.get("content-length") ?? NaN);
  if (declared > limit.maxBytes) throw tooLarge();
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit.maxBytes * DRAIN_FACTOR) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    if (size <= limit.maxBytes) chunks.push(value);
  }
  if (size > limit.maxBytes) throw tooLarge();
  return new TextDecoder().decode(Buffer.concat(chunks));
}
