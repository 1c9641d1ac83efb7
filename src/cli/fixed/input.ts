/**
 * The fixed32 pipeline up to the printers: spec -> family (when its
 * arithmetic's row in src/family/arithmetic.ts is of kind 'fixed') -> fixed
 * plan -> the fixed emit input. `plan` and `verify` read this without loading
 * the printers (those are in pipeline.ts).
 */
import type { FixedEmitInput } from '../../emit/fixed-types.js';
import { arithmeticFacts } from '../../family/arithmetic.js';
import { arithmeticName, type Family } from '../../family/types.js';
import type { FixedPlan } from '../../plan/fixed/plan-fixed.js';
import { loadSpec } from '../../reader/load.js';
import { VERSION } from '../../version.js';

/** Whether the family's arithmetic is a fixed-point one (the table says). */
export function isFixedFamily(family: Family): boolean {
  return arithmeticFacts(arithmeticName(family)).kind === 'fixed';
}

/** The family if the spec is fixed32, else null (the float pipeline takes it). */
export function fixedFamilyOf(file: string): Family | null {
  const family = loadSpec(file);
  return isFixedFamily(family) ? family : null;
}

export function fixedEmitInputOf(plan: FixedPlan): FixedEmitInput {
  return {
    family: plan.family,
    program: plan.program,
    claims: {
      order: plan.order,
      terms: plan.terms,
      degree: plan.degree,
      segments: plan.segments,
      rootNote: `${plan.root.note}; the series is collapsed to a polynomial in ${plan.family.inputs[0]!.name} and Chebyshev-economised to degree ${plan.degree}`,
      bound: plan.bound,
      target: plan.target,
      ops: plan.ops,
      cost: plan.cost,
      rawLo: plan.rawLo,
      rawHi: plan.rawHi,
    },
    generator: { name: 'rootcast', version: VERSION },
  };
}
