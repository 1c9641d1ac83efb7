/**
 * The stamp line every emitted file carries in its header comment, so that
 * `emit --check` can decide from the files alone, without planning again:
 *
 *   rootcast-stamp: spec=NAME.yaml sha256=<spec, 64 hex> generator=rootcast/0.1.0 role=c-function content=<64 hex>
 *
 * `content` is the SHA-256 of the file's own text with the whole stamp line
 * (its newline included) taken out, so an edit anywhere else in the file
 * shows. The spec is named by its file name only (as the header does), so the
 * files a spec wrote can be told apart in a shared output folder, and files
 * that an earlier version of the spec wrote (a renamed function) are found by
 * their stamp. `role` is the file's target and whether it is the function or
 * the harness, so a file's bytes do not depend on which other targets were
 * emitted beside it. Output stays deterministic: every field is a function of
 * the spec, the generator version and the file.
 */
import { sha256Hex } from '../math/sha256.js';

export const STAMP_KEY = 'rootcast-stamp:';
const PENDING = '0'.repeat(64);

/** Which file of which target: `c-function`, `ts-harness`, ... */
export interface FileRole {
  readonly target: string;
  readonly kind: 'function' | 'harness';
}

export interface Stamp {
  readonly role: FileRole;
  readonly spec: string;
  readonly specSha256: string;
  /** `name/version` of the generator. */
  readonly generator: string;
  readonly content: string;
}

/** The stamp's header line with the content hash still to be filled in by sealStamp. */
export function stampLine(spec: string, specSha256: string, generator: string, role: FileRole): string {
  return `${STAMP_KEY} spec=${spec} sha256=${specSha256} generator=${generator} role=${role.target}-${role.kind} content=${PENDING}`;
}

const LINE = /^(.*)rootcast-stamp: spec=(.+) sha256=([0-9a-f]{64}) generator=(\S+) role=([a-z0-9]+)-(function|harness) content=([0-9a-f]{64})(.*)$/m;

/** The text with its stamp's content hash filled in; text without a stamp comes back unchanged. */
export function sealStamp(text: string): string {
  const m = LINE.exec(text);
  if (!m) return text;
  if (m[7] !== PENDING) throw new Error('the file is already sealed');
  const hash = contentHash(text, m.index, m[0].length);
  const sealed = m[0].slice(0, m[0].length - PENDING.length - m[8]!.length) + hash + m[8]!;
  return text.slice(0, m.index) + sealed + text.slice(m.index + m[0].length);
}

/** The stamp of a file's text and whether the text is as sealed; null when the text has no stamp. */
export function readStamp(text: string): { stamp: Stamp; intact: boolean } | null {
  const m = LINE.exec(text);
  if (!m) return null;
  const stamp: Stamp = {
    spec: m[2]!,
    specSha256: m[3]!,
    generator: m[4]!,
    role: { target: m[5]!, kind: m[6] as FileRole['kind'] },
    content: m[7]!,
  };
  return { stamp, intact: contentHash(text, m.index, m[0].length) === stamp.content };
}

/** SHA-256 of the text without the line at [start, start + length) and its newline. */
function contentHash(text: string, start: number, length: number): string {
  const end = text[start + length] === '\n' ? start + length + 1 : start + length;
  return sha256Hex(text.slice(0, start), text.slice(end));
}
