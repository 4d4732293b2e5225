import { sha256 } from "@noble/hashes/sha2.js";
import { bytesToHex, utf8ToBytes } from "@noble/hashes/utils.js";

/**
 * SHA-256 of UTF-8 text as lowercase hex. A maintained, synchronous implementation (@noble/hashes) because the same
 * hash is computed in Node and in the browser's model editor; tests check it against node:crypto.
 */
export function sha256Hex(text: string): string {
  return bytesToHex(sha256(utf8ToBytes(text)));
}
