/**
 * An independent model of IEEE 754 arithmetic for checking evaluate() and the
 * printers: each operation is computed exactly in rationals and then rounded
 * once to the target format (IEEE 754-2019 section 4.3: every basic operation
 * is correctly rounded) by integer arithmetic (Rational.toFloat32 / toNumber),
 * not by the machine's floating-point operations. Zeros lose their sign (rationals have one zero),
 * so compare its results with ===, not by bits.
 */
import type { Program } from '../../../src/ir/nodes.js';
import { Rational } from '../../../src/math/rational.js';

export function exactIeeeEvaluate(program: Program, inputs: readonly number[]): number {
  const round = (r: Rational): Rational =>
    Rational.fromNumber(program.arithmetic === 'float32' ? r.toFloat32() : r.toNumber());
  const v: Rational[] = [];
  for (const n of program.nodes) {
    switch (n.kind) {
      case 'const':
        v.push(Rational.fromNumber(n.value));
        break;
      case 'input':
        v.push(round(Rational.fromNumber(inputs[n.index]!)));
        break;
      case 'neg':
        v.push(v[n.a]!.neg());
        break;
      case 'add':
        v.push(round(v[n.a]!.add(v[n.b]!)));
        break;
      case 'sub':
        v.push(round(v[n.a]!.sub(v[n.b]!)));
        break;
      case 'mul':
        v.push(round(v[n.a]!.mul(v[n.b]!)));
        break;
      case 'div':
        v.push(round(v[n.a]!.div(v[n.b]!)));
        break;
      default:
        throw new Error(`unknown node ${(n as { kind: string }).kind}`);
    }
  }
  return v[program.result]!.toNumber();
}
