/**
 * Writing emitted files: everything is generated in memory first, so a refusal
 * writes nothing; each file is written to a temporary name beside it and
 * renamed, so a build never sees half a file.
 */
import { existsSync, mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { RootcastError } from '../errors.js';
import { dirname, join } from 'node:path';
import type { EmittedFile } from '../emit/types.js';

export function writeFiles(dir: string, files: readonly EmittedFile[]): void {
  if (existsSync(dir) && !statSync(dir).isDirectory()) {
    throw new RootcastError(`--out ${dir} is a file, not a folder; name a folder to write into`);
  }
  for (const f of files) {
    const path = join(dir, f.path);
    mkdirSync(dirname(path), { recursive: true });
    const tmp = `${path}.rootcast-tmp`;
    writeFileSync(tmp, f.text);
    renameSync(tmp, path);
  }
}

/** Files under dir that are missing or differ from what would be written. */
export function staleFiles(dir: string, files: readonly EmittedFile[]): string[] {
  const stale: string[] = [];
  for (const f of files) {
    const path = join(dir, f.path);
    if (!existsSync(path) || readFileSync(path, 'utf8') !== f.text) stale.push(path);
  }
  return stale;
}
