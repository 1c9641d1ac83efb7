/**
 * SHA-256 (FIPS 180-4) in hex, from node:crypto, which is loaded on the first
 * call rather than when the command starts: loading it takes about 5 to 10 ms
 * (DEVELOPERS.md, "V8's code cache"), and a refused spec or a plan printed as
 * text never hashes anything.
 */
import { createRequire } from 'node:module';

let crypto: typeof import('node:crypto') | undefined;

/** The SHA-256 of the parts one after the other (the same as of their concatenation), as 64 hex digits. */
export function sha256Hex(...parts: readonly (string | Uint8Array)[]): string {
  crypto ??= createRequire(import.meta.url)('node:crypto') as typeof import('node:crypto');
  const h = crypto.createHash('sha256');
  for (const p of parts) h.update(p);
  return h.digest('hex');
}
