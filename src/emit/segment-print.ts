/**
 * The segment index and the tables as the shader and Rust printers write
 * them (GLSL, WGSL, HLSL, Rust): one skeleton, the target's syntax passed in.
 * What every target shares: each index part's name `rc_s<node>_<k>` (the GLSL
 * probes of test/glsl/support/probes.ts read it), the clamped fine position
 * `rc_s<node>_<k>g` and the coarse-cell entry `rc_s<node>_<k>m` of a
 * two-level part (TWO-LEVEL INDEX in src/ir/nodes.ts), the strided sum, and
 * the tables written as arrays, coarse-cell tables first at their index node,
 * eight integers or four values a line. How a part is rounded and clamped,
 * how a table is declared and how a vector reads one entry per component is
 * the target's own.
 */
import { valueName } from './names.js';
import type { IndexPart, Program } from '../ir/nodes.js';

/** How one target writes the segment index (see the printers' own notes on the rounding). */
export interface IndexSyntax {
  /** The lines that compute a part's clamped position into `name` (the part's name `s`, or `s` + `g` for a two-level part); `s` prefixes any helper names. */
  clamped(p: IndexPart, s: string, name: string, four: boolean): string[];
  /** The coarse-cell entry line: `m` is the name to declare, read from `table` at `g >> level`. */
  coarse(m: string, table: string, g: string, level: number, four: boolean): string;
  /** The row line of part `s`: s = (sm >> 5) + ((sg & mask) >> (sm & 31)). */
  row(s: string, mask: number, four: boolean): string;
  /** The coarse-cell table's name for part k of index node `at`. */
  cellsName(at: number, k: number): string;
  /** The last line: the segment number from the terms (`rc_s<node>_<k>` or `rc_s<node>_<k> * stride`). */
  sum(name: string, terms: readonly string[], four: boolean): string;
}

/** The segment number of index node `at`: each part clamped (through its coarse cell when two-level), then the strided sum. */
export function indexLines(parts: readonly IndexPart[], at: number, four: (p: IndexPart) => boolean, whole: boolean, syntax: IndexSyntax): string[] {
  const lines: string[] = [];
  const terms: string[] = [];
  parts.forEach((p, k) => {
    if (!Number.isInteger(p.count) || p.count < 1 || !Number.isInteger(p.stride) || p.stride < 0) {
      throw new RangeError(`index part ${k} of node ${at} has count ${p.count} and stride ${p.stride}`);
    }
    const s = `rc_s${at}_${k}`;
    const v = four(p);
    if (p.fine) {
      // TWO-LEVEL INDEX (src/ir/nodes.ts): the coarse cell's entry, then the row.
      lines.push(...syntax.clamped(p, s, `${s}g`, v));
      lines.push(syntax.coarse(`${s}m`, syntax.cellsName(at, k), `${s}g`, p.fine.level, v));
      lines.push(syntax.row(s, (1 << p.fine.level) - 1, v));
    } else lines.push(...syntax.clamped(p, s, s, v));
    terms.push(p.stride === 1 ? s : `${s} * ${p.stride}`);
  });
  lines.push(syntax.sum(valueName(at), terms, whole));
  return lines;
}

/** One entry per component, `table[index.x], ..., table[index.w]`, for a vector read. */
export function componentReads(table: string, index: string): string {
  return ['x', 'y', 'z', 'w'].map((c) => `${table}[${index}.${c}]`).join(', ');
}

/** How one target declares its tables. */
export interface TableSyntax {
  /** Whether a blank line comes before each table. */
  readonly blankBefore: boolean;
  /** Whether every line of entries ends in a comma (Rust), or every line but the last. */
  readonly trailingComma: boolean;
  /** The opening line of a coarse-cell table (integers) and of a value table, and the closing line. */
  cellsOpen(name: string, n: number): string;
  tableOpen(name: string, n: number): string;
  readonly close: string;
  cellsName(at: number, k: number): string;
  tableName(at: number): string;
  literal(v: number): string;
}

/** Every table of the program, in node order: the coarse-cell tables at their index node, then each value table. */
export function tableLines(program: Program, syntax: TableSyntax): string[] {
  const lines: string[] = [];
  const rows = (entries: readonly string[], per: number): void => {
    for (let i = 0; i < entries.length; i += per) {
      const last = i + per >= entries.length;
      lines.push(`    ${entries.slice(i, i + per).join(', ')}${syntax.trailingComma || !last ? ',' : ''}`);
    }
  };
  program.nodes.forEach((node, at) => {
    if (node.kind === 'index') {
      node.parts.forEach((p, k) => {
        if (!p.fine) return;
        const m = p.fine.meta;
        if (syntax.blankBefore) lines.push('');
        lines.push(syntax.cellsOpen(syntax.cellsName(at, k), m.length));
        rows(m.map(String), 8);
        lines.push(syntax.close);
      });
      return;
    }
    if (node.kind !== 'table') return;
    const n = node.values.length;
    if (n < 1) throw new RangeError(`table node ${at} is empty`);
    if (syntax.blankBefore) lines.push('');
    lines.push(syntax.tableOpen(syntax.tableName(at), n));
    rows(node.values.map((v) => syntax.literal(v)), 4);
    lines.push(syntax.close);
  });
  return lines;
}
