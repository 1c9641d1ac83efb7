/** A fresh temporary directory per test file, removed afterwards. */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface WorkDir {
  readonly path: string;
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
