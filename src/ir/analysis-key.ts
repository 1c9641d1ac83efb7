/**
 * Keys for reusing an analysis (issue 10: planning time). `analyseFlat` gives
 * a node its value enclosure and error bound from its operands' alone (an
 * index node: the segment number; a table: its entry for the segment), so
 * what it computes at some nodes (`roots`) over a cell is fixed by the cone of
 * those nodes: their ancestors' kinds, operands and constants' facts, the
 * tables' entries for the segment, the segment number where an operation
 * reads an index node, and the cell. `analysisKey` writes that cone down,
 * its nodes renumbered in order, so two programs (or two segments) with equal
 * keys give the roots the same numbers over every cell, whatever else they
 * compute (the index arithmetic of a segmentation, other nodes). Numbers go in
 * by their bytes, so every float64 is told apart exactly (-0 from 0 too),
 * which a decimal string would not do.
 */
import { FLAT_KINDS, flatParts, type FlatParts } from './analyse-flat.js';
import type { Program } from './nodes.js';

const { CONST, NEG, CLAMP, ADD, DIV, INDEX, TABLE } = FLAT_KINDS;

// A float64 as four UTF-16 code units (its bytes): exact and short.
const bits = new Float64Array(1);
const units = new Uint16Array(bits.buffer);

/** `x` by its bytes, four code units. */
export function floatChars(x: number): string {
  bits[0] = x;
  return String.fromCharCode(units[0]!, units[1]!, units[2]!, units[3]!);
}

/**
 * The program's part (one string instance per program and roots, so a Map
 * lookup hashes it once) and the segment's part of a key.
 */
export interface AnalysisKey {
  readonly structure: string;
  readonly segment: string;
}

interface Cone {
  readonly structure: string;
  /** The cone's table nodes (their places among the program's tables), in order. */
  readonly tables: readonly number[];
  /** Whether an operation of the cone reads an index node. */
  readonly readsIndex: boolean;
}

const cones = new WeakMap<Program, Map<string, Cone>>();

/**
 * What `analyseFlat(program, cell, { segment })` computes at `roots` depends
 * on besides the cell; null when the analysis also reads an enclosure hook
 * (attachEnclosures: not part of the program, so not keyable).
 */
export function analysisKey(program: Program, segment: number, roots: readonly number[]): AnalysisKey | null {
  const parts = flatParts(program, segment);
  if (!parts) return null;
  let byRoots = cones.get(program);
  if (!byRoots) cones.set(program, (byRoots = new Map()));
  const rootsKey = roots.join(',');
  let cone = byRoots.get(rootsKey);
  if (!cone) byRoots.set(rootsKey, (cone = coneOf(program, parts.compiled, roots)));
  let s = '';
  const t = parts.table;
  for (const place of cone.tables) s += floatChars(t!.lo[place]!) + floatChars(t!.hi[place]!) + floatChars(t!.err[place]!);
  return { structure: cone.structure, segment: cone.readsIndex ? `${s}${segment}` : s };
}

function coneOf(program: Program, c: FlatParts['compiled'], roots: readonly number[]): Cone {
  const { op, a, b } = c;
  const binary = (k: number): boolean => k >= ADD && k <= DIV;
  const unary = (k: number): boolean => k === NEG || k === CLAMP;
  const marked = new Uint8Array(op.length);
  for (const r of roots) marked[r] = 1;
  for (let i = op.length - 1; i >= 0; i--) {
    if (!marked[i]) continue;
    if (unary(op[i]!) || binary(op[i]!)) marked[a[i]!] = 1;
    if (binary(op[i]!)) marked[b[i]!] = 1;
  }
  const renumber = new Int32Array(op.length).fill(-1);
  let next = 0;
  let s = `${program.arithmetic};`;
  const tables: number[] = [];
  let readsIndex = false;
  for (let i = 0; i < op.length; i++) {
    if (!marked[i]) continue;
    renumber[i] = next++;
    const k = op[i]!;
    // Each node: its kind, then what that kind reads (a fixed count of floats follows a kind that has them).
    s += `${k},`;
    if (k === CONST) s += floatChars(c.lo[i]!) + floatChars(c.hi[i]!) + floatChars(c.err[i]!) + floatChars(c.errFtz[i]!);
    else if (k === TABLE) tables.push(a[i]!);
    else if (k !== INDEX) {
      // An input's index, or the operands by their new numbers.
      s += unary(k) || binary(k) ? `${renumber[a[i]!]},` : `${a[i]!},`;
      if (binary(k)) s += `${renumber[b[i]!]},`;
      if (k === CLAMP) s += floatChars(c.lo[i]!) + floatChars(c.hi[i]!);
      if ((unary(k) || binary(k)) && (op[a[i]!] === INDEX || (binary(k) && op[b[i]!] === INDEX))) readsIndex = true;
    }
  }
  s += `;${roots.map((r) => renumber[r]).join(',')}`;
  return { structure: s, tables, readsIndex };
}
