/**
 * The command line: the only place that knows about argv, files on the user's
 * side and exit codes. Exit 0 success; 1 verification failed or --check found
 * differences; 2 bad spec, bad usage or an impossible plan (one line on stderr).
 */
import yargs from 'yargs';
import { RootcastError } from '../errors.js';
import { VERSION } from '../version.js';
// Commands are loaded when they run, so `plan` and `--help` never load the
// TypeScript compiler that the TypeScript printer needs (about 2 s).

const out = (line: string): void => {
  process.stdout.write(`${line}\n`);
};

const TARGET_CHOICES = ['c', 'ts', 'glsl', 'wgsl', 'hlsl', 'rust', 'all'] as const;

export async function main(argv: string[]): Promise<number> {
  let code = 0;
  const parser = yargs(argv)
    .scriptName('rootcast')
    .usage('rootcast: certified, branch-free polynomial root functions in C and TypeScript\n\nUsage: $0 <command> [options]')
    .command(
      'new <name>',
      'write NAME.yaml, a commented starter spec',
      (y) =>
        y
          .positional('name', { type: 'string', demandOption: true, describe: 'function name (a C, TypeScript and GLSL identifier)' })
          .option('out', { type: 'string', describe: 'file to write instead of NAME.yaml' }),
      async (a) => {
        const { runNew } = await import('./commands/new.js');
        code = runNew(a.name, a.out, out);
      },
    )
    .command(
      'plan <spec>',
      'print the chosen plan (root, centre, segments, order, terms, Newton steps, certified bounds, op counts) and every candidate weighed',
      (y) =>
        y
          .positional('spec', { type: 'string', demandOption: true, describe: 'spec file (YAML or JSON)' })
          .option('json', { type: 'boolean', default: false, describe: 'print one JSON object instead of text' }),
      async (a) => {
        const { fixedFamilyOf } = await import('./fixed/pipeline.js');
        const fixed = fixedFamilyOf(a.spec);
        if (fixed) {
          const { fixedPlanJson, fixedPlanText } = await import('./fixed/plan.js');
          const { makeFixedPlan } = await import('../plan/fixed/plan-fixed.js');
          const plan = makeFixedPlan(fixed);
          out(a.json ? JSON.stringify(fixedPlanJson(plan), null, 2) : fixedPlanText(plan));
          return;
        }
        const { planJson, planText } = await import('./commands/plan.js');
        const { planSpec } = await import('./pipeline.js');
        const plan = planSpec(a.spec);
        out(a.json ? JSON.stringify(planJson(plan), null, 2) : planText(plan));
      },
    )
    .command(
      'emit <spec>',
      'write the function and its verification harness',
      (y) =>
        y
          .positional('spec', { type: 'string', demandOption: true, describe: 'spec file (YAML or JSON)' })
          .option('target', { choices: TARGET_CHOICES, default: 'all' as const, describe: 'language to emit (all: c, ts and rust, plus glsl, wgsl and hlsl when the spec is float32)' })
          .option('out', { type: 'string', demandOption: true, describe: 'output directory' })
          .option('check', {
            type: 'boolean',
            default: false,
            describe: 'write nothing; exit 1 and name the files if DIR is out of date',
          }),
      async (a) => {
        const { runEmit } = await import('./commands/emit.js');
        code = await runEmit({ spec: a.spec, target: a.target, out: a.out, check: a.check }, out);
      },
    )
    .command(
      'verify <spec>',
      'check the plan in process, then build and run each target harness against exact bisection',
      (y) =>
        y
          .positional('spec', { type: 'string', demandOption: true, describe: 'spec file (YAML or JSON)' })
          .option('target', { choices: TARGET_CHOICES, default: 'all' as const, describe: 'harnesses to build and run (all: c, ts, and glsl in headless Chromium when the spec is float32; wgsl, hlsl and rust run when named)' })
          .option('samples', { type: 'number', default: 10000, describe: 'sample points (corners, a grid, seeded random); segment edges and their neighbours come on top' })
          .option('seed', { type: 'number', default: 1, describe: 'seed of the random sample points' })
          .option('json', { type: 'boolean', default: false, describe: 'print one JSON object (plan claims and every check) instead of text' })
          .option('report', { type: 'string', describe: 'also write FILE.html, a self-contained page plotting the measured error' }),
      async (a) => {
        const { runVerify } = await import('./commands/verify.js');
        if (!Number.isInteger(a.samples) || a.samples < 1) throw new RootcastError('--samples must be a positive integer');
        if (!Number.isInteger(a.seed) || a.seed < 0 || a.seed > 0xffffffff) throw new RootcastError('--seed must be an integer from 0 to 4294967295');
        if (a.report !== undefined && !/\.html?$/i.test(a.report)) throw new RootcastError('--report needs a file name ending in .html');
        code = runVerify(
          { spec: a.spec, target: a.target, samples: a.samples, seed: a.seed, json: a.json, report: a.report, progress: process.stderr },
          out,
        );
      },
    )
    .demandCommand(1, 'name a command: new, plan, emit or verify')
    .strict()
    .version(VERSION)
    .help()
    .wrap(Math.min(100, process.stdout.columns || 100))
    .exitProcess(false)
    .fail((msg, err) => {
      throw err ?? new UsageError(msg);
    });
  try {
    await parser.parseAsync();
  } catch (e) {
    if (e instanceof RootcastError) {
      process.stderr.write(`${e.toLine()}\n`);
      return e.exitCode;
    }
    if (e instanceof UsageError) {
      // yargs writes some messages over several lines: one line, always.
      const flat = e.message.replace(/\s*\n\s*/g, '; ').replace(/:;/g, ':');
      process.stderr.write(`rootcast: ${flat} (see rootcast --help)\n`);
      return 2;
    }
    throw e;
  }
  return code;
}

class UsageError extends Error {}
