import { REFERENCE_LIMITS } from "./reference-bands/types";

/**
 * Byte limits of what people send, one per kind of content, with the one message each path shows. Pure: the forms
 * check them in the browser before sending, the server before it parses.
 */
const MIB = 1024 * 1024;

/** A model document's JSON text (as the editor and the API send it: compact, UTF-8). */
export const DOCUMENT_MAX_BYTES = 2 * MIB;
export const DOCUMENT_TOO_LARGE = "The model document is larger than 2 MiB, the limit for a model document.";

/** A reference band file (CSV or JSON), as docs/reference-bands.md states. */
export const REFERENCE_MAX_BYTES = REFERENCE_LIMITS.maxBytes;
export const REFERENCE_TOO_LARGE = "The reference file is larger than 5 MiB, the limit for a reference band file.";

/** Room for the fields beside a document or a file in one request (title, rationale, note, provenance, framing). */
export const ENVELOPE_BYTES = 256 * 1024;

/** Any other JSON body (remarks, verdicts, moves, fit settings): far above what their own field limits allow. */
export const JSON_BODY_MAX_BYTES = 256 * 1024;
export const BODY_TOO_LARGE = "The request body is larger than 256 KiB, the limit for this request.";

/**
 * Server actions (form posts): the largest carries a model document. Next.js reads no more than this; twice the
 * document limit, so a document somewhat over its limit still reaches the action and gets the message above.
 */
export const ACTION_BODY_MAX_BYTES = 2 * DOCUMENT_MAX_BYTES;

/** UTF-8 length of a string without encoding it. */
export function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length && (text.charCodeAt(i + 1) & 0xfc00) === 0xdc00) {
      bytes += 4;
      i++;
    } else bytes += 3;
  }
  return bytes;
}
