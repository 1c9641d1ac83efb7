/** The constants the coefficient expressions use, in the spec's order (checked to have values and plain names). */
import { constantsUsed } from '../../family/expr-uses.js';
import type { Family } from '../../family/types.js';
import { assertUserName } from '../names.js';

export function usedConstantsOf(family: Family): string[] {
  const used = new Set<string>();
  family.coefficients.forEach((e) => e && constantsUsed(e, used));
  for (const c of used) {
    if (!(c in family.constants)) throw new Error(`constant ${c} is used but has no value`);
    assertUserName(c, 'constant name');
  }
  return Object.keys(family.constants).filter((c) => used.has(c));
}
