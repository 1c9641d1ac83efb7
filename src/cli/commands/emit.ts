/**
 * `rootcast emit SPEC... --target c|ts|glsl|all --out DIR [--check] [--no-harness] [--depfile FILE]`.
 * Each spec is handled on its own: a refused spec prints its one line and the
 * others are still emitted or checked; the exit code is the worst one.
 */
import { basename, dirname } from 'node:path';
import { RootcastError } from '../../errors.js';
import { targetsOf } from '../../emit/outputs.js';
import { checkOutputs } from '../check.js';
import { depfileText, type DepRule } from '../depfile.js';
import { writeFiles } from '../files.js';

export interface EmitOptions {
  specs: readonly string[];
  target: string;
  out: string;
  check: boolean;
  harness: boolean;
  depfile?: string;
}

type Print = (line: string) => void;

/** Returns the exit code; prints what it wrote or what is stale, and refusals on `printError`. */
export async function runEmit(o: EmitOptions, print: Print, printError: Print): Promise<number> {
  let code = 0;
  const rules: DepRule[] = [];
  for (const spec of o.specs) {
    try {
      code = Math.max(code, o.check ? checkOne(spec, o, print, o.specs.length > 1) : await emitOne(spec, o, print, rules));
    } catch (e) {
      if (!(e instanceof RootcastError)) throw e;
      printError(e.toLine());
      code = Math.max(code, e.exitCode);
    }
  }
  // Like a compiler's -MF: the dependency file is written only when every spec was emitted.
  if (o.depfile !== undefined && !o.check && code === 0) writeFiles(dirname(o.depfile), [{ path: basename(o.depfile), text: depfileText(rules) }]);
  return code;
}

async function emitOne(spec: string, o: EmitOptions, print: Print, rules: DepRule[]): Promise<number> {
  // The planners and printers only when emitting (`--check` reads stamps and plans nothing).
  const { filesOfSpec } = await import('../spec-files.js');
  const files = filesOfSpec(spec, targetsOf(o.target), { harness: o.harness });
  writeFiles(o.out, files);
  const dir = o.out.replace(/\/$/, '');
  for (const f of files) print(`wrote ${dir}/${f.path}`);
  rules.push({ outputs: files.map((f) => `${dir}/${f.path}`), input: spec });
  return 0;
}

function checkOne(spec: string, o: EmitOptions, print: Print, several: boolean): number {
  const r = checkOutputs(spec, o.out, { target: o.target, harness: o.harness });
  if (r.stale.length === 0 && r.leftOver.length === 0) {
    print(`up to date: ${r.expected.length} files in ${o.out}${several ? ` (from ${spec})` : ''}`);
    return 0;
  }
  if (r.stale.length > 0) {
    const command = `rootcast emit ${spec} --target ${o.target}${o.harness ? '' : ' --no-harness'} --out ${o.out}`;
    print(`out of date (regenerate with ${command}): ${r.stale.map((s) => `${s.path} (${s.why})`).join(', ')}`);
  }
  if (r.leftOver.length > 0) {
    print(`left over (${spec} no longer produces these; delete them): ${r.leftOver.join(', ')}`);
  }
  return 1;
}
