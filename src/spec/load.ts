/**
 * Reading a spec from disk: the one place in src/spec/ that touches the file
 * system. The bytes are hashed as read; the text is decoded as UTF-8 (a
 * leading byte-order mark is dropped, as editors do not show it).
 */
import { readFileSync } from 'node:fs';
import { RootcastError } from '../errors.js';
import { WHOLE_FILE } from './context.js';
import { readSpec } from './read.js';
import type { Family } from './types.js';

export function loadSpec(file: string): Family {
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
