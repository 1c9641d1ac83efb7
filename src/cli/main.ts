/**
 * The command line: the only place that knows about argv, files on the user's
 * side and exit codes. Exit 0 success; 1 verification failed or --check found
 * differences; 2 bad spec, bad usage or an impossible plan (one line on stderr).
 */
import yargs, { type Argv } from 'yargs';
import { RootcastError } from '../errors.js';
import { VERSION } from '../version.js';
// Commands are loaded when they run, so `plan` and `--help` never load the
// TypeScript compiler that the TypeScript printer needs (about 2 s).

const out = (line: string): void => {
  process.stdout.write(`${line}\n`);
};
const err = (line: string): void => {
  process.stderr.write(`${line}\n`);
};

const TARGET_CHOICES = ['c', 'ts', 'glsl', 'wgsl', 'hlsl', 'rust', 'all'] as const;

const newOptions = (y: Argv) =>
  y
    .positional('name', { type: 'string', demandOption: true, describe: 'function name (a C, TypeScript and GLSL identifier)' })
    .option('out', { type: 'string', describe: 'file to write instead of NAME.yaml' });

const planOptions = (y: Argv) =>
  y
    .positional('specs', { type: 'string', array: true, demandOption: true, describe: 'spec files (YAML or JSON); a refused one prints its line, the others are still planned' })
    .option('json', { type: 'boolean', default: false, describe: 'print one JSON object per spec (an array for several), refusals included, instead of text' });

const emitOptions = (y: Argv) =>
  y
    .positional('specs', { type: 'string', array: true, demandOption: true, describe: 'spec files (YAML or JSON); a refused one prints its line, the others are still emitted' })
    .option('target', { choices: TARGET_CHOICES, default: 'all' as const, describe: 'language to emit (all: c, ts and rust, plus glsl, wgsl and hlsl when the spec is float32)' })
    .option('out', { type: 'string', demandOption: true, describe: 'output directory' })
    .option('check', {
      type: 'boolean',
      default: false,
      describe: 'write nothing; read the files\' stamps (no planning) and exit 1 naming every stale, missing or left-over file',
    })
    .option('harness', { type: 'boolean', default: true, describe: 'also write each target\'s verification harness (--no-harness: the function files only)' })
    .option('depfile', { type: 'string', describe: 'also write FILE, a Make-format dependency file (outputs: spec), when every spec was emitted' });

const verifyOptions = (y: Argv) =>
  y
    .positional('specs', { type: 'string', array: true, demandOption: true, describe: 'spec files (YAML or JSON); a refused one prints its line, the others are still checked' })
    .option('target', { choices: TARGET_CHOICES, default: 'all' as const, describe: 'targets to check (all, the default: c and ts, plus glsl in headless Chromium when the spec is float32; the bit runners wgsl, hlsl and rust each start a browser or a compiler and run only when named; float32 and fixed32 C also run on QEMU\'s emulated cores)' })
    .option('samples', { type: 'number', default: 10000, describe: 'sample points (corners, a grid, seeded random); segment edges and their neighbours come on top' })
    .option('seed', { type: 'number', default: 1, describe: 'seed of the random sample points' })
    .option('json', { type: 'boolean', default: false, describe: 'print one JSON object per spec (plan claims and every check; an array for several), refusals included' })
    .option('report', { type: 'string', describe: 'also write FILE.html, a self-contained page plotting the measured error (one spec)' });

/** The parsed arguments of one command, as its builder above declares them. */
type ArgsOf<B extends (y: Argv) => Argv<unknown>> = Awaited<ReturnType<B>['argv']>;

/**
 * The commands run after yargs has parsed and validated the whole line, not as
 * yargs command handlers, and each command's module is imported only when it
 * runs. yargs still gives each command a no-op handler and renders the
 * command's full help text before calling it, in case it fails; our failures
 * never show that help, and the bundle drops the rendering
 * (scripts/bundle.js, `yargsCommand`).
 */
const COMMANDS = {
  new: async (a: ArgsOf<typeof newOptions>): Promise<number> => {
    const { runNew } = await import('./commands/new.js');
    return runNew(a.name, a.out, out);
  },
  plan: async (a: ArgsOf<typeof planOptions>): Promise<number> => {
    const { runPlan } = await import('./commands/plan.js');
    return runPlan({ specs: a.specs, json: a.json }, out, err);
  },
  emit: async (a: ArgsOf<typeof emitOptions>): Promise<number> => {
    if (a.check && a.depfile !== undefined) throw new RootcastError('--depfile writes a file and --check writes nothing: leave --depfile out of the check');
    const { runEmit } = await import('./commands/emit.js');
    return runEmit({ specs: a.specs, target: a.target, out: a.out, check: a.check, harness: a.harness, depfile: a.depfile }, out, err);
  },
  verify: async (a: ArgsOf<typeof verifyOptions>): Promise<number> => {
    const { runVerify } = await import('./commands/verify.js');
    if (!Number.isInteger(a.samples) || a.samples < 1) throw new RootcastError('--samples must be a positive integer');
    if (!Number.isInteger(a.seed) || a.seed < 0 || a.seed > 0xffffffff) throw new RootcastError('--seed must be an integer from 0 to 4294967295');
    if (a.report !== undefined && !/\.html?$/i.test(a.report)) throw new RootcastError('--report needs a file name ending in .html');
    return runVerify(
      { specs: a.specs, target: a.target, samples: a.samples, seed: a.seed, json: a.json, report: a.report, progress: process.stderr },
      out,
      err,
    );
  },
};

export async function main(argv: string[]): Promise<number> {
  const parser = yargs(argv)
    .scriptName('rootcast')
    .usage('rootcast: certified, branch-free polynomial root functions in C and TypeScript\n\nUsage: $0 <command> [options]')
    .command('new <name>', 'write NAME.yaml, a commented starter spec', newOptions)
    .command(
      'plan <specs..>',
      'print the chosen plan (root, centre, segments, order, terms, Newton steps, certified bounds, op counts) and every candidate weighed, for each spec',
      planOptions,
    )
    .command('emit <specs..>', 'write the function and its verification harness for each spec', emitOptions)
    .command('verify <specs..>', 'check the plan in process, then build and run each target harness against exact bisection, for each spec', verifyOptions)
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
    const a = await parser.parseAsync();
    // --help and --version have been answered (yargs printed them); no command runs.
    if (a['help'] === true || a['version'] === true) return 0;
    const name = a._[0] as keyof typeof COMMANDS;
    // yargs' strict mode has checked the command and each argument against its builder.
    return await (COMMANDS[name] as (args: typeof a) => Promise<number>)(a);
  } catch (e) {
    if (e instanceof RootcastError) {
      process.stderr.write(`${e.toLine()}\n`);
      await printJsonRefusal(argv, e);
      return e.exitCode;
    }
    if (e instanceof UsageError) {
      // yargs writes some messages over several lines: one line, always.
      const flat = e.message.replace(/\s*\n\s*/g, '; ').replace(/:;/g, ':');
      process.stderr.write(`rootcast: ${flat} (see rootcast --help)\n`);
      await printJsonRefusal(argv, new RootcastError(`${flat} (see rootcast --help)`));
      return 2;
    }
    throw e;
  }
}

class UsageError extends Error {}

/** Under `plan --json` and `verify --json`, a refusal of the command itself (bad usage) is a JSON object on stdout too. */
async function printJsonRefusal(argv: readonly string[], e: RootcastError): Promise<void> {
  if (!argv.includes('--json') || !['plan', 'verify'].includes(argv[0] ?? '')) return;
  const { refusalJson } = await import('./refusal-json.js');
  out(JSON.stringify(refusalJson(e, null), null, 2));
}
