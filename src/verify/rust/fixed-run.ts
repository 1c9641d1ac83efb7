/**
 * The fixed32 Rust bit runner: builds the emitted NAME.rs with rustc as a
 * `#![no_std]` library with every warning an error (so it uses only core), and
 * in a debug build inside a driver (templates/rust/fixed-driver.rs.hbs; debug,
 * so any arithmetic overflow would panic instead of wrapping silently), then
 * runs it on raw int32 arguments. The caller compares the integers with the
 * in-process evaluation (and so with the C): equal integers carry the
 * certified bound over to the Rust function.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { RootcastError } from '../../errors.js';
import { renderTemplate } from '../../emit/templates.js';
import type { EmittedFile } from '../../emit/types.js';

export interface FixedRustRun {
  /** One result per row, or null when a build or the run failed. */
  readonly results: bigint[] | null;
  readonly problem: string;
}

export function runRustFixed(file: EmittedFile, name: string, inputCount: number, rows: readonly (readonly bigint[])[], rustc = 'rustc'): FixedRustRun {
  if (spawnSync(rustc, ['--version'], { encoding: 'utf8' }).status !== 0) {
    throw new RootcastError(`${rustc} not found: install Rust (for example apt-get install rustc) or use another --target`);
  }
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-rust-fixed-'));
  try {
    writeFileSync(join(dir, file.path), file.text);
    const module = file.path.replace(/\.rs$/, '');
    writeFileSync(join(dir, 'lib.rs'), `#![no_std]\npub mod ${module};\n`);
    const lib = spawnSync(rustc, ['-O', '--edition', '2021', '--crate-type=lib', '-D', 'warnings', '-o', join(dir, 'libcheck.rlib'), join(dir, 'lib.rs')], { encoding: 'utf8' });
    if (lib.status !== 0) return { results: null, problem: `the #![no_std] library build failed: ${firstLines(lib.stderr)}` };
    writeFileSync(
      join(dir, 'driver.rs'),
      renderTemplate('rust/fixed-driver.rs.hbs', {
        modulePath: join(dir, file.path),
        inputCount,
        name,
        arguments: Array.from({ length: inputCount }, (_, i) => `w[${i}]`).join(', '),
      }),
    );
    const exe = join(dir, 'driver');
    // Debug build (overflow checks on): a wrapping the C does not do would panic here.
    const build = spawnSync(rustc, ['--edition', '2021', '-C', 'overflow-checks=on', '-D', 'warnings', '-o', exe, join(dir, 'driver.rs')], { encoding: 'utf8' });
    if (build.status !== 0) return { results: null, problem: `the driver build failed: ${firstLines(build.stderr)}` };
    const run = spawnSync(exe, [], { input: rows.map((r) => r.join(' ')).join('\n') + '\n', encoding: 'utf8', maxBuffer: 1 << 28 });
    if (run.status !== 0) return { results: null, problem: `the driver failed (exit ${run.status}): ${firstLines(run.stderr)}` };
    return { results: run.stdout.trim().split('\n').filter((l) => l !== '').map((l) => BigInt(l)), problem: '' };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function firstLines(text: string): string {
  return text.trim().split('\n').slice(0, 3).join(' / ');
}
