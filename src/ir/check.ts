/**
 * The IR checker: every operand defined before use, every kind used with the
 * right type (the segment index is an integer that only table reads may
 * take; every other operand is a float), tables as long as the segment count,
 * constants finite. Returns the problems found (empty when the program is sound).
 */
import { operands } from './operands.js';
import { partRows, type Program } from './nodes.js';

export function checkProgram(program: Program): string[] {
  const problems: string[] = [];
  const isIndex = (r: number): boolean => program.nodes[r]?.kind === 'index';
  let segments: number | null = null;
  program.nodes.forEach((n, i) => {
    for (const r of operands(n)) {
      if (!Number.isInteger(r) || r < 0 || r >= i) problems.push(`node ${i} (${n.kind}) reads node ${r}, not defined before it`);
    }
    switch (n.kind) {
      case 'const':
        if (!Number.isFinite(n.value)) problems.push(`node ${i}: constant ${n.value} is not finite`);
        break;
      case 'input':
        if (n.index < 0 || n.index >= program.inputs.length) problems.push(`node ${i}: no input ${n.index}`);
        break;
      case 'clamp':
        if (!(Number.isFinite(n.lo) && Number.isFinite(n.hi) && n.lo <= n.hi)) problems.push(`node ${i}: clamp to [${n.lo}, ${n.hi}] is not a finite range`);
        if (isIndex(n.a)) problems.push(`node ${i} (clamp) uses the integer segment index as a float`);
        break;
      case 'index': {
        const count = n.parts.reduce((a, p) => a * partRows(p), 1);
        for (const p of n.parts) {
          const f = p.fine;
          if (!f) continue;
          const cells = p.count >> f.level;
          if (f.meta.length !== cells || cells << f.level !== p.count) problems.push(`node ${i}: ${f.meta.length} coarse cells for ${p.count} fine positions at level ${f.level}`);
          let next = 0;
          for (const m of f.meta) {
            const drop = m & 31;
            if (m >> 5 !== next || drop > f.level) problems.push(`node ${i}: coarse entry ${m} does not follow row ${next}`);
            next += 2 ** (f.level - drop);
          }
          if (next !== f.rows) problems.push(`node ${i}: the coarse cells hold ${next} rows, not ${f.rows}`);
        }
        if (segments !== null && segments !== count) problems.push(`node ${i}: a second segment index with ${count} segments`);
        segments = count;
        for (const p of n.parts) if (isIndex(p.t)) problems.push(`node ${i}: its t operand is an index, not a float`);
        break;
      }
      case 'table':
        if (!isIndex(n.index)) problems.push(`node ${i}: table read at node ${n.index}, which is not a segment index`);
        if (segments !== null && n.values.length !== segments) problems.push(`node ${i}: table of ${n.values.length} for ${segments} segments`);
        if (n.values.some((v) => !Number.isFinite(v))) problems.push(`node ${i}: table holds a non-finite value`);
        break;
      default:
        for (const r of operands(n)) if (isIndex(r)) problems.push(`node ${i} (${n.kind}) uses the integer segment index as a float`);
    }
  });
  if (program.result < 0 || program.result >= program.nodes.length) problems.push(`result ${program.result} is not a node`);
  else if (isIndex(program.result)) problems.push('the result is the segment index, not a float');
  return problems;
}
