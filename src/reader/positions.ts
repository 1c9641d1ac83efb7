/**
 * From offsets in the spec text to the 1-based line and column a user sees,
 * and from a character of a scalar's value (an expression string) back to
 * its offset in the file, through quotes, escapes and folded lines.
 */
import type { LineCounter, Scalar } from 'yaml';
import type { Pos } from '../family/types.js';

/** 1-based line and column of a 0-based offset. */
export function posAt(lines: LineCounter, offset: number): Pos {
  const { line, col } = lines.linePos(offset);
  return { line, column: col };
}

/**
 * For each index i in 0..value.length of the scalar's string value, the
 * offset in `text` of that character (the last entry is the offset just past
 * the value). When the value appears verbatim in the source (plain scalars,
 * quoted scalars without escapes), this is a shift. Otherwise the value is
 * walked against the source: an escape (`\t`, `\x41`, `''`) counts as the one
 * character it stands for, and line breaks and indentation that YAML folds
 * or strips are skipped. If the walk loses its place, every index maps to the
 * start of the scalar, so a message still points at the right field.
 */
export function valueOffsets(text: string, node: Scalar, value: string): number[] {
  const [start, valueEnd] = node.range ?? [0, 0];
  const quoted = node.type === 'QUOTE_DOUBLE' || node.type === 'QUOTE_SINGLE';
  const block = node.type === 'BLOCK_LITERAL' || node.type === 'BLOCK_FOLDED';
  let contentStart = quoted ? start + 1 : start;
  if (block) {
    const eol = text.indexOf('\n', start);
    contentStart = eol < 0 ? valueEnd : eol + 1;
  }
  if (text.startsWith(value, contentStart) && contentStart + value.length <= valueEnd) {
    return Array.from({ length: value.length + 1 }, (_, i) => contentStart + i);
  }
  const walked = walk(text, contentStart, valueEnd, value, node.type);
  return walked ?? Array.from({ length: value.length + 1 }, () => start);
}

const isSpace = (c: string | undefined): boolean => c !== undefined && /\s/.test(c);

function walk(text: string, from: number, to: number, value: string, type: Scalar['type']): number[] | null {
  const out: number[] = [];
  let j = from;
  for (let i = 0; i < value.length; i++) {
    const ch = value[i]!;
    // Whitespace the value does not have here was folded or stripped by YAML.
    if (!isSpace(ch)) while (j < to && isSpace(text[j])) j++;
    if (j >= to) return null;
    out.push(j);
    if (type === 'QUOTE_DOUBLE' && text[j] === '\\') j += escapeLength(text, j);
    else if (type === 'QUOTE_SINGLE' && ch === "'" && text[j] === "'" && text[j + 1] === "'") j += 2;
    else if (text[j] === ch || (isSpace(ch) && isSpace(text[j]))) j++;
    else return null;
  }
  out.push(j);
  return out;
}

/** Source length of the double-quoted escape at `j` (YAML 1.2 section 5.7). */
function escapeLength(text: string, j: number): number {
  const c = text[j + 1];
  return c === 'x' ? 4 : c === 'u' ? 6 : c === 'U' ? 10 : 2;
}
