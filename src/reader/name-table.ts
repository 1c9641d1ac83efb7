/**
 * The names a spec declares (function, unknown, inputs, constants) share one
 * namespace: they meet in the same generated function, so no two may be the
 * same. The table remembers who took a name first, for the message.
 */
import type { SpecContext } from './context.js';
import type { Pos } from '../family/types.js';

export type NameRole = 'the function' | 'the unknown' | 'an input' | 'a constant';

export class NameTable {
  private readonly taken = new Map<string, { role: NameRole; pos: Pos }>();

  /** Declare `name`; refuse it if an earlier declaration took it. */
  claim(ctx: SpecContext, name: string, role: NameRole, pos: Pos, field: string): void {
    const first = this.taken.get(name);
    if (first) {
      const where = first.pos.line > 0 ? ` (line ${first.pos.line})` : '';
      ctx.fail(`\`${name}\` is already the name of ${first.role}${where}; choose another name`, pos, field);
    }
    this.taken.set(name, { role, pos });
  }
}
