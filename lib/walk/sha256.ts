// SHA-256 through @noble/hashes (pure JavaScript, synchronous), so that the phone and the server
// hash a report the same way without Node's crypto or the browser's async SubtleCrypto.
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils.js';

/** The SHA-256 of bytes, or of a string's UTF-8 bytes, as 64 lower-case hex digits. */
export function sha256Hex(input: string | Uint8Array): string {
  return bytesToHex(sha256(typeof input === 'string' ? utf8ToBytes(input) : input));
}
