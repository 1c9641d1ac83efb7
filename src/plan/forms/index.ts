/**
 * The planner's forms, in the order they are weighed for one segmentation.
 * Each row says when the form applies (its preconditions, as data) and how
 * it builds its plans; src/plan/plan-segments.ts runs the rows in order and
 * keeps the cheapest plan by the cost model. The order matters: a row's
 * preconditions and builder can read the plans of the rows above it (the
 * economised and greedy forms start from the graded series; the polished
 * forms must beat every plan above them), and the candidate table lists the
 * plans in this order.
 *
 * To add a form: write src/plan/forms/<name>.ts with a builder
 * `(ctx: FormContext, found: FoundPlans) => readonly Plan[]` that makes its
 * plans with `planOf` (src/plan/plan-of.ts), put its tuning constants in
 * src/plan/tuning.ts, and add one row here.
 */
import { ECONOMISE } from '../tuning.js';
import type { FormRow, Precondition } from './context.js';
import { economisedPlan } from './economised.js';
import { foldedPlan } from './folded.js';
import { greedyPlan, qVaries } from './greedy.js';
import { polishedPlans } from './polished.js';
import { seriesOrderPlan } from './series-order.js';

const seriesFound: Precondition = { says: 'the graded series met the target', holds: (_, found) => found.first('series-order') !== null };
const oneInput: Precondition = { says: 'one input', holds: (ctx) => ctx.family.inputs.length === 1 };
const atMostSegments = (n: number): Precondition => ({ says: `at most ${n} segments`, holds: (ctx) => ctx.layout.segmentation.segments <= n });
const seriesOrderAtMost = (n: number): Precondition => ({ says: `the graded series' order at most ${n}`, holds: (_, found) => found.first('series-order')!.order <= n });
const someQVaries: Precondition = { says: 'some q_k varies with the inputs', holds: (ctx) => qVaries(ctx.ap) };
const stepsAllowed: Precondition = { says: 'plan.newton_steps is not 0', holds: (ctx) => ctx.family.plan.newtonSteps !== 0 };

/** The result stage's folded trial weighs the folded form alone; every other form plans the root. */
const rootPlanned: Precondition = { says: 'the root is planned (not the folded trial)', holds: (ctx) => !ctx.family.foldResult };
const folding: Precondition = { says: "the result stage's folded trial", holds: (ctx) => ctx.family.foldResult === true && ctx.family.result !== undefined };

const one = <T>(x: T | null): T[] => (x ? [x] : []);

export const FORMS: readonly FormRow[] = [
  { name: 'series-order', requires: [rootPlanned], keepsRefusal: true, build: (ctx) => [seriesOrderPlan(ctx)] },
  {
    name: 'economised',
    requires: [rootPlanned, seriesFound, oneInput, atMostSegments(ECONOMISE.maxSegments), seriesOrderAtMost(ECONOMISE.maxOrder)],
    keepsRefusal: false,
    build: (ctx, found) => one(economisedPlan(ctx, found.first('series-order')!)),
  },
  { name: 'greedy', requires: [rootPlanned, seriesFound, someQVaries], keepsRefusal: false, build: (ctx, found) => one(greedyPlan(ctx, found.first('series-order')!)) },
  { name: 'polished', requires: [rootPlanned, stepsAllowed], keepsRefusal: false, build: polishedPlans },
  { name: 'folded', requires: [folding, oneInput], keepsRefusal: false, build: (ctx) => one(foldedPlan(ctx)) },
];
