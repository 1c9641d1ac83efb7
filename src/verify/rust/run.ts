/**
 * The Rust bit runner: builds the emitted module twice with rustc (the Rust
 * compiler; Debian's package `rustc`), once as a `#![no_std]` library with
 * every warning an error (so the file really uses only core), once inside a
 * small driver (templates/rust/bits-driver.rs.hbs) that reads input bits and
 * prints result bits. The caller compares those bits with the in-process
 * evaluation of the same program: equal bits carry its checked error and the
 * certified bound over to the Rust function.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { RootcastError } from '../../errors.js';
import type { EmittedFile } from '../../emit/types.js';
import { renderTemplate } from '../../emit/templates.js';
import type { Program } from '../../ir/nodes.js';
import { bitsOf } from '../bits.js';
import { ARITHMETICS } from '../../family/arithmetic.js';

/** rustc flags: optimised, edition 2021 (TOOLCHAIN.md, "HLSL and Rust"). */
export const RUSTC_FLAGS = ['-O', '--edition', '2021'] as const;

export interface RustRun {
  /** One hex word per row, or null when a build failed. */
  readonly bits: string[] | null;
  /** The first failing step's compiler output, empty on success. */
  readonly problem: string;
}

export function rustcAvailable(rustc = 'rustc'): boolean {
  return spawnSync(rustc, ['--version'], { encoding: 'utf8' }).status === 0;
}

/** Builds and runs `file` (NAME.rs) on the rows (input values, already in the program's arithmetic). */
export function runRustBits(file: EmittedFile, program: Program, name: string, rows: readonly (readonly number[])[], rustc = 'rustc'): RustRun {
  if (!rustcAvailable(rustc)) throw new RootcastError(`${rustc} not found: install Rust (for example apt-get install rustc) or use another --target`);
  const dir = mkdtempSync(join(tmpdir(), 'rootcast-rust-'));
  try {
    writeFileSync(join(dir, file.path), file.text);
    const module = file.path.replace(/\.rs$/, '');
    writeFileSync(join(dir, 'lib.rs'), `#![no_std]\npub mod ${module};\n`);
    const lib = spawnSync(rustc, [...RUSTC_FLAGS, '--crate-type=lib', '-D', 'warnings', '-o', join(dir, 'libcheck.rlib'), join(dir, 'lib.rs')], { encoding: 'utf8' });
    if (lib.status !== 0) return { bits: null, problem: `the #![no_std] library build failed: ${firstLines(lib.stderr)}` };
    const facts = ARITHMETICS[program.arithmetic];
    const driver = renderTemplate('rust/bits-driver.rs.hbs', {
      modulePath: join(dir, file.path),
      word: facts.rustBitsType,
      type: facts.rustType,
      digits: 2 * facts.bytes,
      inputCount: program.inputs.length,
      name,
      arguments: program.inputs.map((_, i) => `${facts.rustType}::from_bits(w[${i}])`).join(', '),
    });
    writeFileSync(join(dir, 'driver.rs'), driver);
    const exe = join(dir, 'driver');
    const build = spawnSync(rustc, [...RUSTC_FLAGS, '-D', 'warnings', '-o', exe, join(dir, 'driver.rs')], { encoding: 'utf8' });
    if (build.status !== 0) return { bits: null, problem: `the driver build failed: ${firstLines(build.stderr)}` };
    const stdin = rows.map((r) => r.map((x) => bitsOf(x, program.arithmetic)).join(' ')).join('\n') + '\n';
    const run = spawnSync(exe, [], { input: stdin, encoding: 'utf8', maxBuffer: 1 << 28 });
    if (run.status !== 0) return { bits: null, problem: `the driver failed (exit ${run.status}): ${firstLines(run.stderr)}` };
    return { bits: run.stdout.split('\n').filter((l) => l !== ''), problem: '' };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function firstLines(text: string): string {
  return text.trim().split('\n').slice(0, 3).join(' | ');
}
