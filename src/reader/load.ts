/**
 * Reading a spec from disk: the one place in src/reader/ that touches the file
 * system. The bytes are hashed as read; the text is decoded as UTF-8 (a
 * leading byte-order mark is dropped, as editors do not show it).
 */
import { readFileSync } from 'node:fs';
import { RootcastError } from '../errors.js';
import { WHOLE_FILE } from './context.js';
import { readSpec } from './read.js';
import type { Family } from '../family/types.js';

export function loadSpec(file: string): Family {
  const unsafe = unsafePathPart(file);
  if (unsafe) {
    throw new RootcastError(
      `the spec's path contains ${unsafe}, which cannot be written into the generated files' header comment; rename the file or its directory`,
      { file: JSON.stringify(file).slice(1, -1), line: 0, column: 0, field: WHOLE_FILE },
    );
  }
  let bytes: Uint8Array;
  try {
    bytes = readFileSync(file);
  } catch (err) {
    throw new RootcastError(`cannot read the spec: ${describeFsError(err)}`, { file, line: 0, column: 0, field: WHOLE_FILE });
  }
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new RootcastError('the spec is not UTF-8 text; save it as UTF-8', { file, line: 0, column: 0, field: WHOLE_FILE });
  }
  return readSpec(file, text, bytes);
}

function describeFsError(err: unknown): string {
  const code = (err as { code?: unknown } | null)?.code;
  switch (code) {
    case 'ENOENT':
      return 'no such file; check the path';
    case 'EISDIR':
      return 'it is a directory; give the path of a .yaml file';
    case 'EACCES':
    case 'EPERM':
      return 'permission denied';
    default:
      return typeof code === 'string' ? `${code}` : 'unreadable';
  }
}

/**
 * Every emitted file names the spec path in a comment (C and TypeScript block
 * comments, and a <script> in an HTML page), so the path must not be able to
 * end that comment or element, or break its line.
 */
function unsafePathPart(file: string): string | null {
  if (/[\u0000-\u001f\u007f\u2028\u2029]/.test(file)) return 'a line break or control character';
  for (const marker of ['*/', '/*']) if (file.includes(marker)) return `\`${marker}\``;
  if (/[<>]/.test(file)) return '`<` or `>`';
  return null;
}
