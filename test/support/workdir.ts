/** A temporary directory for compiled artefacts, one per test file, removed in afterAll (shared by the emit, examples, targets, fixed-cost and verify tests). */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface WorkDir {
  readonly path: string;
  /** Writes a file in the directory and returns its full path. */
  write(name: string, text: string): string;
  remove(): void;
}

export function makeWorkDir(prefix: string): WorkDir {
  const path = mkdtempSync(join(tmpdir(), `rootcast-${prefix}-`));
  return {
    path,
    write(name, text) {
      const file = join(path, name);
      writeFileSync(file, text);
      return file;
    },
    remove() {
      rmSync(path, { recursive: true, force: true });
    },
  };
}
