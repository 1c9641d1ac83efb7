/**
 * Plans of the example specs, kept on disk between test files.
 *
 * A dozen test files plan every example in process (emit, run, compare),
 * and each of them used to plan it again: about 30 s of CPU per file for the
 * nine examples, in each of them. The planner is deterministic (output is
 * byte-identical for the same spec and version, DEVELOPERS.md), so the first
 * test file that needs a plan stores it and the others read it.
 *
 * The key is the spec's text and path plus a fingerprint of every file under
 * src/ (and package-lock.json and the Node version): any change to the
 * planner, the reader or the IR makes a new key, so a stale plan is never
 * read. The files live in node_modules/.cache/rootcast-test-plans/, which a
 * clean clone does not have. golden.test.ts and the
 * planner's own tests never read this cache; they plan afresh, and
 * golden.test.ts compares the emitted files with generated-samples/.
 * test/support/plan-cache.test.ts checks that a plan read back is equal
 * (toStrictEqual, prototypes included) to the plan made, and emits the same
 * files.
 *
 * Storage: v8.serialize (structured clone: bigint, undefined, NaN, -0 and
 * shared references survive), after `Rational` and `SpecNumber` instances,
 * the classes a plan holds, are replaced by tagged plain objects. A plan
 * holding any other class instance or a function is not stored (it is
 * planned every time), so the cache can only fall back, never return a
 * changed object. `certifiedCells` is left out (NOT_STORED).
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { deserialize, serialize } from 'node:v8';
import { planSpec } from '../../src/cli/pipeline.js';
import { SpecNumber } from '../../src/family/spec-number.js';
import { Rational } from '../../src/math/rational.js';
import { makePlan, type Plan } from '../../src/plan/plan.js';
import { readSpec } from '../../src/reader/read.js';

const REPO = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const TAG = '__rootcastPlanCacheClass';

/** The cache folder: under node_modules/.cache, which a clean clone does not have. */
const CACHE_ROOT = join(REPO, 'node_modules', '.cache', 'rootcast-test-plans');

/**
 * `Plan.certifiedCells` is the planner's per-cell working state (with its
 * Bernstein caches), read only by the result stage while planning; nothing
 * after planning reads it, so it is not stored.
 */
export const NOT_STORED = 'certifiedCells';

class Uncacheable extends Error {}

function filesUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true })
    .sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))
    .flatMap((e) => (e.isDirectory() ? filesUnder(join(dir, e.name)) : [join(dir, e.name)]));
}

let fingerprint: string | null = null;
/** sha256 over the path and bytes of every file under src/, package-lock.json (the reader's YAML parser) and the Node version. */
export function sourceFingerprint(): string {
  if (fingerprint !== null) return fingerprint;
  const h = createHash('sha256').update(process.version).update(readFileSync(join(REPO, 'package-lock.json')));
  for (const f of filesUnder(join(REPO, 'src'))) h.update(relative(REPO, f)).update('\0').update(readFileSync(f)).update('\0');
  fingerprint = h.digest('hex').slice(0, 24);
  return fingerprint;
}

function encode(value: unknown, memo: Map<object, unknown>): unknown {
  if (typeof value === 'function' || typeof value === 'symbol') throw new Uncacheable(typeof value);
  if (value === null || typeof value !== 'object') return value;
  const seen = memo.get(value);
  if (seen !== undefined) return seen;
  if (value instanceof Rational) {
    const out = { [TAG]: 'Rational', num: value.num, den: value.den };
    memo.set(value, out);
    return out;
  }
  if (value instanceof SpecNumber) {
    const out = { [TAG]: 'SpecNumber', text: value.text, value: encode(value.value, memo) };
    memo.set(value, out);
    return out;
  }
  if (Array.isArray(value)) {
    const out: unknown[] = [];
    memo.set(value, out);
    for (const v of value) out.push(encode(v, memo));
    return out;
  }
  const proto = Object.getPrototypeOf(value) as unknown;
  if (proto !== Object.prototype && proto !== null) throw new Uncacheable((value as object).constructor?.name ?? 'an object without constructor');
  const out: Record<string, unknown> = proto === null ? Object.create(null) : {};
  memo.set(value, out);
  for (const k of Object.keys(value)) if (k !== NOT_STORED) out[k] = encode((value as Record<string, unknown>)[k], memo);
  return out;
}

function decode(value: unknown, memo: Map<object, unknown>): unknown {
  if (value === null || typeof value !== 'object') return value;
  const seen = memo.get(value);
  if (seen !== undefined) return seen;
  if (Array.isArray(value)) {
    const out: unknown[] = [];
    memo.set(value, out);
    for (const v of value) out.push(decode(v, memo));
    return out;
  }
  const rec = value as Record<string, unknown>;
  if (rec[TAG] === 'Rational') {
    const out = Rational.of(rec.num as bigint, rec.den as bigint, true);
    memo.set(value, out);
    return out;
  }
  if (rec[TAG] === 'SpecNumber') {
    const out = new SpecNumber(rec.text as string, decode(rec.value, memo) as Rational);
    memo.set(value, out);
    return out;
  }
  const out: Record<string, unknown> = {};
  memo.set(value, out);
  for (const k of Object.keys(rec)) out[k] = decode(rec[k], memo);
  return out;
}

/** The plan as bytes, or null when it holds something the cache does not store. */
export function planToBytes(plan: Plan): Buffer | null {
  try {
    return serialize(encode(plan, new Map()));
  } catch (e) {
    if (e instanceof Uncacheable) return null;
    throw e;
  }
}

export function planFromBytes(bytes: Buffer): Plan {
  return decode(deserialize(bytes), new Map()) as Plan;
}

/** planSpec(specPath), read from the cache when a plan of the same spec text and source is there. */
export function cachedPlanSpec(specPath: string): Plan {
  return cached(specPath, readFileSync(resolve(specPath)), () => planSpec(specPath));
}

/** makePlan(readSpec(file, text)): a spec given as text (an example with a field added, say), through the cache. */
export function cachedPlanOf(file: string, text: string): Plan {
  return cached(file, Buffer.from(text, 'utf8'), () => makePlan(readSpec(file, text)));
}

function cached(file: string, text: Buffer, make: () => Plan): Plan {
  const key = createHash('sha256').update(file).update('\0').update(text).digest('hex').slice(0, 24);
  const dir = join(CACHE_ROOT, sourceFingerprint());
  const path = join(dir, `${key}.bin`);
  try {
    if (statSync(path).isFile()) return planFromBytes(readFileSync(path));
  } catch {
    // Not cached yet.
  }
  const plan = make();
  const bytes = planToBytes(plan);
  if (bytes !== null) {
    mkdirSync(dir, { recursive: true });
    const tmp = `${path}.${process.pid}.tmp`;
    writeFileSync(tmp, bytes);
    renameSync(tmp, path);
  }
  return plan;
}
