import { sha256Hex } from "@/lib/tb/sha256";
import { parseReferenceCsv } from "./parse-csv";
import { parseReferenceJson } from "./parse-json";
import { fail, REFERENCE_LIMITS, type ParsedReferenceBands } from "./types";

function utf8Length(text: string): number {
  return new TextEncoder().encode(text).length;
}

/** JSON when the name ends in .json or the content opens with "{"; the CSV form otherwise. */
export function isJsonUpload(fileName: string, text: string): boolean {
  return /\.json$/i.test(fileName.trim()) || text.trimStart().startsWith("{");
}

/** The stored text must not hold U+0000 (PostgreSQL cannot keep it), not even in a comment. */
function refuseNul(text: string): void {
  const at = text.indexOf("\u0000");
  if (at < 0) return;
  const before = text.slice(0, at);
  const line = before.split("\n").length;
  const column = at - before.lastIndexOf("\n");
  fail({ line, column, message: `line ${line}, column ${column}: the file holds a NUL character (U+0000); save it as plain UTF-8 text` });
}

/** Reads an uploaded reference-bands file (CSV or JSON form); energies come back in eV. */
export function parseReferenceBands(fileName: string, text: string): ParsedReferenceBands {
  // cheap bound first: a UTF-16 code unit never takes more than 3 UTF-8 bytes
  if (text.length * 3 > REFERENCE_LIMITS.maxBytes) {
    const bytes = utf8Length(text);
    if (bytes > REFERENCE_LIMITS.maxBytes) {
      fail({ message: `the file is too large: ${bytes} bytes, the limit is ${REFERENCE_LIMITS.maxBytes} bytes (5 MiB)` });
    }
  }
  const body = text.startsWith("\uFEFF") ? text.slice(1) : text;
  refuseNul(body);
  return isJsonUpload(fileName, body) ? parseReferenceJson(body) : parseReferenceCsv(body);
}

/** Lowercase hex SHA-256 of the uploaded text (UTF-8), as stored with the upload's provenance. */
export function referenceChecksum(text: string): string {
  return sha256Hex(text);
}
