/**
 * What every field reader needs: the file name for messages, the source text
 * and its line table, and one way to refuse. Every refusal is a RootcastError
 * carrying file, line, column and field path, so the user sees one line.
 */
import type { LineCounter, Node } from 'yaml';
import { RootcastError } from '../errors.js';
import { posAt } from './positions.js';
import type { Pos } from '../family/types.js';

/** Field path for problems with the file as a whole (empty, not YAML, not a map). */
export const WHOLE_FILE = '(file)';

/** A position for facts that have none, such as an empty file. */
export const NO_POS: Pos = { line: 0, column: 0 };

export class SpecContext {
  constructor(
    readonly file: string,
    readonly text: string,
    readonly lines: LineCounter,
  ) {}

  pos(offset: number): Pos {
    return posAt(this.lines, offset);
  }

  /** Where a node's text starts (its first character, after any tag or anchor). */
  nodePos(node: Node): Pos {
    return this.pos(node.range?.[0] ?? 0);
  }

  fail(message: string, at: Pos, field: string): never {
    throw new RootcastError(message, { file: this.file, line: at.line, column: at.column, field });
  }
}
