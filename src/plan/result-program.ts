/**
 * The spec's `result:` as IR: y = sum_k r_k x^k by Horner's rule in the root
 * x, each r_k a coefficient expression in the inputs and constants (src/family/result-powers.ts)
 * brought to exact affine form first (src/plan/linear-form.ts), so constant
 * parts fold exactly and a zero coefficient costs nothing.
 *
 * One function builds the operations both for the emitted program (x = the
 * root program's result) and for the analysis program (x an exact extra
 * input after the family's inputs), so the rounding bound is the bound of
 * exactly the operations the function performs (the pattern of the Newton
 * step, src/plan/polish.ts).
 */
import { Rational } from '../math/rational.js';
import { ProgramBuilder, type Ref } from '../ir/builder.js';
import type { Program } from '../ir/nodes.js';
import type { Family, ResultSpec } from '../family/types.js';
import { formOf, materialise } from './linear-form.js';

/** y = result(x) from the root x, on the builder `b`. */
export function resultOf(b: ProgramBuilder, family: Family, spec: ResultSpec, x: Ref): Ref {
  const coef = spec.powers.map((e) => (e ? materialise(b, formOf(b, e, family.constants)) : null));
  const n = coef.length - 1;
  let acc = coef[n] ?? b.const(Rational.ZERO);
  for (let k = n - 1; k >= 0; k--) {
    acc = b.mul(acc, x);
    const c = coef[k];
    if (c !== null && c !== undefined) acc = b.add(acc, c);
  }
  return acc;
}

/** The emitted program: the root program, then the result at its root. */
export function appendResult(root: Program, family: Family, spec: ResultSpec): Program {
  const b = ProgramBuilder.resume(root);
  return b.finish(resultOf(b, family, spec, root.result));
}

/** The result alone, for the rounding analysis: the root is an exact input after the family's inputs. */
export function resultAnalysisProgram(family: Family, spec: ResultSpec): Program {
  const b = new ProgramBuilder(family.arithmetic, [...family.inputs.map((i) => i.name), family.unknown]);
  return b.finish(resultOf(b, family, spec, b.input(family.inputs.length)));
}
