/**
 * Reading YAML maps the strict way the spec needs: keys are plain scalars,
 * each key at most once, no aliases, and only the keys a field allows (with a
 * "did you mean" for a near miss). The yaml package is asked not to check
 * duplicate keys itself, so the refusal here can name the field path.
 */
import { isAlias, isMap, isScalar, isSeq, type Node, type Scalar } from 'yaml';
import { WHOLE_FILE, type SpecContext } from './context.js';
import { didYouMean } from './edit-distance.js';
import { showText } from '../family/show.js';
import type { Pos } from '../family/types.js';

export interface Entry {
  /** The key as written (its source text). */
  readonly key: string;
  readonly keyNode: Scalar;
  readonly keyPos: Pos;
  /** The value node, or null when the key has no value at all. */
  readonly value: Node | null;
  /** Dotted field path of this entry, such as `inputs.R`. */
  readonly field: string;
}

/**
 * The dotted path of `key` under `parent`. A key is shown on one line:
 * control characters (a quoted key may hold a line break) are escaped, and a
 * very long key is cut.
 */
export function childField(parent: string, key: string): string {
  const shown = showText(key, 64);
  return parent === '' ? shown : `${parent}.${shown}`;
}

/** A short description of what a node is, for "expected X, found Y" messages. */
export function describeNode(node: Node | null): string {
  if (node === null) return 'nothing';
  if (isAlias(node)) return `an alias (*${showText(node.source)})`;
  if (isMap(node)) return 'a map';
  if (isSeq(node)) return 'a list';
  if (isScalar(node)) {
    const v = node.value;
    if (v === null) return node.source === '' || node.source === undefined ? 'nothing' : `null (\`${node.source}\`)`;
    if (typeof v === 'number' || typeof v === 'bigint') return `the number ${clip(String(node.source ?? v))}`;
    if (typeof v === 'boolean') return `\`${String(v)}\``;
    if (typeof v === 'string') return `the text \`${clip(v)}\``;
  }
  return 'something else';
}

function clip(s: string): string {
  return showText(s.replace(/\s+/g, ' '));
}

/** True for a missing value: `key:` with nothing after it, or an explicit null. */
export function isEmptyValue(node: Node | null): boolean {
  return node === null || (isScalar(node) && node.value === null);
}

/** Refuse an alias (`*name`): the spec wants each value written where it applies. */
export function refuseAlias(ctx: SpecContext, node: Node | null, field: string): void {
  if (node !== null && isAlias(node)) {
    ctx.fail(`aliases (*${showText(node.source)}) are not supported here; write the value out`, ctx.nodePos(node), field);
  }
}

/**
 * The entries of a map node, in file order. `what` describes the expected
 * map for the message when the node is something else ("a map of input names
 * to ranges"); `at` is where to point when the node is missing.
 */
export function expectMap(ctx: SpecContext, node: Node | null, field: string, at: Pos, what: string): Entry[] {
  // The top level has the empty path; its own problems belong to the whole file.
  const self = field === '' ? WHOLE_FILE : field;
  refuseAlias(ctx, node, self);
  if (node === null || !isMap(node)) {
    ctx.fail(`expected ${what}, found ${describeNode(node)}`, node ? ctx.nodePos(node) : at, self);
  }
  const entries: Entry[] = [];
  const seen = new Map<string, Pos>();
  for (const pair of node.items) {
    const keyNode = pair.key as Node | null;
    if (keyNode === null || !isScalar(keyNode) || keyNode.value === null) {
      const where = keyNode ? ctx.nodePos(keyNode) : pair.value ? ctx.nodePos(pair.value as Node) : at;
      ctx.fail(`every entry needs a plain key (a name or a number) before the colon`, where, self);
    }
    const key = String(keyNode.source ?? keyNode.value);
    const keyPos = ctx.nodePos(keyNode);
    const entryField = childField(field, key);
    const first = seen.get(key);
    if (first) {
      ctx.fail(`\`${showText(key)}\` appears twice (first at line ${first.line}); keep one`, keyPos, entryField);
    }
    seen.set(key, keyPos);
    const value = (pair.value as Node | null) ?? null;
    refuseAlias(ctx, value, entryField);
    entries.push({ key, keyNode, keyPos, value, field: entryField });
  }
  return entries;
}

/** Refuse any key not in `allowed`, suggesting the closest allowed one. */
export function refuseUnknownKeys(ctx: SpecContext, entries: readonly Entry[], allowed: readonly string[], where: string): void {
  for (const e of entries) {
    if (!allowed.includes(e.key)) {
      const hint = didYouMean(e.key, allowed) || `; the fields ${where} are ${allowed.map((a) => `\`${a}\``).join(', ')}`;
      ctx.fail(`unknown field \`${clip(e.key)}\`${hint}`, e.keyPos, e.field);
    }
  }
}

/** The entry's value, refusing a key with nothing after it. */
export function valueOf(ctx: SpecContext, e: Entry, what: string): Node {
  if (isEmptyValue(e.value)) {
    const written = e.value !== null && isScalar(e.value) && e.value.source !== '' && e.value.source !== undefined;
    ctx.fail(`has no value; write ${what}`, written ? ctx.nodePos(e.value as Node) : e.keyPos, e.field);
  }
  return e.value as Node;
}
