/**
 * `emit --check` without planning: the spec is read (not planned), its
 * SHA-256 and function name give the files it would produce (outputs.ts), and
 * each file's stamp line (src/emit/stamp.ts) says whether it is still what
 * `emit` would write: same spec bytes, same generator version, same role
 * (target, function or harness), and its own content unchanged since it was
 * written. Regenerating from the same spec with the same generator gives the
 * same bytes (emitted output is deterministic), so a file that passes all
 * four is up to date. Files in the folder whose stamp names this spec (by
 * file name) with a role this check asks for, but which it no longer produces
 * (a renamed function, a spec now float64 without GLSL), are left over.
 * fixed32 files carry the same stamp (src/emit/fixed-header.ts), and the
 * targets the fixed32 row allows give their names.
 */
import { closeSync, existsSync, openSync, readdirSync, readSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { specPathForHeader } from '../emit/header.js';
import { refuseUnlessFloat32 } from '../emit/glsl/refuse.js';
import { refuseTargetForFixed } from '../emit/fixed-refuse.js';
import { readStamp } from '../emit/stamp.js';
import { arithmeticFacts } from '../family/arithmetic.js';
import { arithmeticName } from '../family/types.js';
import { loadSpec } from '../reader/load.js';
import { VERSION } from '../version.js';
import { outputFiles, targetsOf, type TargetName } from '../emit/outputs.js';


export interface CheckResult {
  /** Paths (joined with the folder) emit would write. */
  readonly expected: readonly string[];
  /** Each stale file and why: missing, no stamp, edited, spec changed, written by another version, another file, another spec. */
  readonly stale: readonly { readonly path: string; readonly why: string }[];
  /** Stamped by this spec with a role this check asks for, but no longer produced. */
  readonly leftOver: readonly string[];
}

/** How many bytes of a file are searched for a stamp when looking for left-overs (the stamp is in the header). */
const STAMP_WINDOW = 16384;

export interface CheckOptions {
  /** The `--target` value (`all`, `c`, ...). */
  readonly target: string;
  /** False under `--no-harness`. */
  readonly harness: boolean;
}

export function checkOutputs(spec: string, dir: string, options: CheckOptions): CheckResult {
  const family = loadSpec(spec);
  const targets = targetsOf(options.target);
  const arithmetic = arithmeticName(family);
  if (targets.length === 1 && targets[0] === 'glsl') refuseUnlessFloat32(family);
  if (targets.length === 1 && arithmeticFacts(arithmetic).kind === 'fixed') refuseTargetForFixed(family, targets[0]!);
  const files = outputFiles(family.functionName, arithmetic, targets, options.harness);
  const names = files.map((f) => f.path);
  const specName = specPathForHeader(family.file);
  const generator = `rootcast/${VERSION}`;
  const stale: { path: string; why: string }[] = [];
  for (const { path: name, role } of files) {
    const path = join(dir, name);
    if (!existsSync(path)) {
      stale.push({ path, why: 'missing' });
      continue;
    }
    const read = readStamp(readText(path));
    const why =
      read === null
        ? 'no stamp'
        : !read.intact
          ? 'edited'
          : read.stamp.spec !== specName
            ? 'other spec'
            : read.stamp.specSha256 !== family.specHash
              ? 'spec changed'
              : read.stamp.generator !== generator
                ? `written by ${read.stamp.generator}`
                : read.stamp.role.target !== role.target || read.stamp.role.kind !== role.kind
                  ? `holds the ${read.stamp.role.target} ${read.stamp.role.kind}`
                  : null;
    if (why !== null) stale.push({ path, why });
  }
  return { expected: names.map((n) => join(dir, n)), stale, leftOver: leftOvers(dir, new Set(names), specName, targets, options.harness) };
}

function leftOvers(dir: string, expected: ReadonlySet<string>, specName: string, targets: readonly TargetName[], harness: boolean): string[] {
  if (!existsSync(dir) || !statSync(dir).isDirectory()) return [];
  const out: string[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))) {
    if (!entry.isFile() || expected.has(entry.name)) continue;
    const path = join(dir, entry.name);
    const read = readStamp(readHead(path));
    if (!read || read.stamp.spec !== specName) continue;
    const asked = (targets as readonly string[]).includes(read.stamp.role.target) && (harness || read.stamp.role.kind === 'function');
    if (asked) out.push(path);
  }
  return out;
}

function readText(path: string): string {
  return new TextDecoder('utf-8').decode(readBytes(path, Infinity));
}

function readHead(path: string): string {
  return new TextDecoder('utf-8').decode(readBytes(path, STAMP_WINDOW));
}

function readBytes(path: string, limit: number): Uint8Array {
  const size = statSync(path).size;
  const n = Math.min(size, limit);
  const buf = Buffer.alloc(n);
  const fd = openSync(path, 'r');
  try {
    let at = 0;
    while (at < n) {
      const got = readSync(fd, buf, at, n - at, at);
      if (got === 0) break;
      at += got;
    }
  } finally {
    closeSync(fd);
  }
  return buf;
}
