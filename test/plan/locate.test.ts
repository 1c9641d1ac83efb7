/**
 * plan/locate.ts: a field's position in the spec for a message. The
 * positions are counted by hand in the spec text below (line, column of the
 * value), the outside reference.
 */
import { describe, expect, test } from '@jest/globals';
import { locate } from '../../src/plan/locate.js';
import { readSpec } from '../../src/reader/read.js';

const TEXT = ['function: f', 'unknown: x', 'degree: 2', 'coefficients:', '  0: -s', '  2: 1', 'inputs:', '  s: [1, 4]', 'root:', '  bracket: [0, 3]', 'accuracy:', '  relative: 1e-5', 'arithmetic: float64', ''].join('\n');
const family = readSpec('where.yaml', TEXT);

describe('locate', () => {
  test('a field the spec wrote: its own line and column', () => {
    expect(locate(family, 'root.bracket')).toEqual({ file: 'where.yaml', line: 10, column: 12, field: 'root.bracket' });
    expect(locate(family, 'accuracy.relative')).toEqual({ file: 'where.yaml', line: 12, column: 13, field: 'accuracy.relative' });
  });

  test('a field the spec left out: its section, else line 1 column 1, the field name kept', () => {
    const plan = locate(family, 'plan.max_order');
    expect(plan.field).toBe('plan.max_order');
    expect(plan).toEqual({ file: 'where.yaml', line: 1, column: 1, field: 'plan.max_order' });
    const sub = locate(family, 'root.nothing');
    expect(sub.field).toBe('root.nothing');
    expect([sub.line, sub.column]).toEqual([family.positions['root']!.line, family.positions['root']!.column]);
  });
});
