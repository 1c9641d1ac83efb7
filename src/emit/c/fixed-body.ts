/**
 * The body of a fixed32 C function, printed from the fixed IR. Every line is
 * defined behaviour in ISO C99 for every int32 argument (C99 6.3.1.3 and
 * 6.5.7 leave conversions of out-of-range values to signed types and right
 * shifts of negative values to the implementation, and signed overflow
 * undefined):
 * - adds and subtracts are done in uint32 and read back with rc_fx_i32 (no
 *   conversion of an out-of-range value to int32 anywhere);
 * - a rounded product round(a b / 2^s) is a logical shift of the product's
 *   64-bit two's complement bits plus a bias: for s <= 32 the low 32 bits of
 *   (bits + 2^(s-1)) >> s already equal those of the floor; for s > 32 the bias
 *   2^63 makes the sum non-negative and 2^(63-s) is taken off afterwards;
 * - the segment number is clamped with uint32 operations only.
 * Inside the box no value wraps (the planner's proof). With
 * ROOTCAST_TRAP_OVERFLOW defined, rc_fx_add and rc_fx_sub use signed int32
 * operators instead, so -fsanitize=signed-integer-overflow reports any
 * overflow (the tests build the harness that way).
 */
import { fixedOperands, UnknownFixedNodeError, type FixedProgram } from '../../ir/fixed/nodes.js';
import { valueName } from '../names.js';

export function cInt32(v: bigint): string {
  return v === -(2n ** 31n) ? '(-2147483647 - 1)' : v.toString();
}

const u64 = (v: bigint): string => `UINT64_C(${v})`;

export function cFixedBodyLines(p: FixedProgram): string[] {
  const lines: string[] = [];
  const used = new Set<number>();
  p.nodes.forEach((n) => fixedOperands(n).forEach((o) => used.add(o)));
  p.inputs.forEach((name, i) => {
    if (!p.nodes.some((n) => n.kind === 'input' && n.index === i)) lines.push(`(void)${name};`);
  });
  p.nodes.forEach((n, i) => {
    const name = valueName(i);
    switch (n.kind) {
      case 'input':
        lines.push(`const int32_t ${name} = ${p.inputs[n.index]};`);
        break;
      case 'const':
        lines.push(`const int32_t ${name} = ${cInt32(n.value)};`);
        break;
      case 'segment': {
        const last = n.count - 1;
        lines.push(`uint32_t ${name} = ((uint32_t)${valueName(n.input)} - ${BigInt.asUintN(32, n.origin)}u) >> ${n.shift};`);
        lines.push(`${name} -= (${name} - ${last}u) & (0u - ((${last}u - ${name}) >> 31));`);
        break;
      }
      case 'table':
        lines.push(`static const int32_t rc_tab${i}[${n.values.length}] = {`);
        for (let k = 0; k < n.values.length; k += 6) lines.push(`    ${n.values.slice(k, k + 6).map(cInt32).join(', ')},`);
        lines.push('};');
        lines.push(`const int32_t ${name} = rc_tab${i}[${valueName(n.index)}];`);
        break;
      case 'add':
        lines.push(`const int32_t ${name} = rc_fx_add(${valueName(n.a)}, ${valueName(n.b)});`);
        break;
      case 'sub':
        lines.push(`const int32_t ${name} = rc_fx_sub(${valueName(n.a)}, ${valueName(n.b)});`);
        break;
      case 'mulshift':
        lines.push(`const int32_t ${name} = ${mulShift(n.a, n.b, n.shift)};`);
        break;
      default:
        throw new UnknownFixedNodeError(n);
    }
  });
  p.nodes.forEach((n, i) => {
    if (!used.has(i) && i !== p.result && n.kind !== 'segment') lines.push(`(void)${valueName(i)};`);
  });
  lines.push(`return ${valueName(p.result)};`);
  return lines;
}

function mulShift(a: number, b: number, s: number): string {
  const product = `rc_fx_mul(${valueName(a)}, ${valueName(b)})`;
  if (s === 0) return `rc_fx_i32((uint32_t)${product})`;
  if (s < 0) return `rc_fx_i32((uint32_t)(${product} << ${-s}))`;
  if (s <= 32) return `rc_fx_i32((uint32_t)((${product} + ${u64(1n << BigInt(s - 1))}) >> ${s}))`;
  const bias = (1n << 63n) + (1n << BigInt(s - 1));
  return `rc_fx_i32((uint32_t)((${product} + ${u64(bias)}) >> ${s}) - ${1n << BigInt(63 - s)}u)`;
}
