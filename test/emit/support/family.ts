/**
 * A hand-made Family and EmitInput for printer tests. The scenario is
 * invented (a demo, not a reference): a strain-gauge bridge whose output is
 * linearised by a small polynomial. Only the fields the printers read matter.
 */
import { createHash } from 'node:crypto';
import { countOps } from '../../../src/ir/count.js';
import type { Program } from '../../../src/ir/nodes.js';
import type { EmitInput, PlanClaims } from '../../../src/emit/types.js';
import type { Family } from '../../../src/family/types.js';
import { SpecNumber } from '../../../src/family/spec-number.js';

export const DEMO_SPEC_TEXT = 'function: bridge_strain\nunknown: T\n# invented demo spec\n';

export function demoFamily(program: Program, overrides: Partial<Family> = {}): Family {
  return {
    file: 'specs/bridge_strain.yaml',
    specHash: createHash('sha256').update(DEMO_SPEC_TEXT).digest('hex'),
    functionName: 'bridge_strain',
    unknown: 'T',
    degree: 2,
    coefficients: [null, null, null],
    coefficientText: ['1 - R / R0', 'A', 'B'],
    inputs: program.inputs.map((name) => ({ name, lo: SpecNumber.parse('-0.5'), hi: SpecNumber.parse('0.5') })),
    constants: { R0: SpecNumber.parse('100'), A: SpecNumber.parse('3.9083e-3'), B: SpecNumber.parse('-5.775e-7') },
    bracket: null,
    accuracy: { kind: 'absolute', value: SpecNumber.parse('0.001') },
    arithmetic: program.arithmetic,
    plan: { maxOrder: 40, segments: 'auto', maxTableBytes: 4096, newtonSteps: 'auto' },
    outsideBox: 'extrapolate',
    positions: {},
    ...overrides,
  };
}

export function demoClaims(program: Program, overrides: Partial<PlanClaims> = {}): PlanClaims {
  return {
    order: 6,
    terms: 7,
    steps: 0,
    rootNote: 'the simple root near -c0/c1, series centred at the box centre',
    bound: { kind: 'absolute', truncation: 1.234e-5, rounding: 3.01e-6, total: 1.5350000000000001e-5 },
    absoluteBound: 1.5350000000000001e-5,
    target: 0.001,
    ops: countOps(program),
    ...overrides,
  };
}

export function demoInput(program: Program, family: Partial<Family> = {}, claims: Partial<PlanClaims> = {}): EmitInput {
  return {
    family: demoFamily(program, family),
    program,
    claims: demoClaims(program, claims),
    generator: { name: 'rootcast', version: '0.1.0' },
  };
}
