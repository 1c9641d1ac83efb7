/**
 * Runs the IR checker (src/ir/check.ts) after building every program in the
 * tests: ProgramBuilder.finish (and finishMapped) is wrapped so that a program that fails the
 * checker throws where it is built, naming its problems. Loaded for every
 * test file by jest.config.js (setupFilesAfterEnv), in the same module
 * registry as the test, so the planner, the fixtures and the tests' own
 * programs all pass through it.
 */
import { ProgramBuilder } from '../../src/ir/builder.js';
import { checkProgram } from '../../src/ir/check.js';
import type { Program } from '../../src/ir/nodes.js';

const finish = ProgramBuilder.prototype.finish;
if (!(finish as { checked?: boolean }).checked) {
  const checked = function (this: ProgramBuilder, result: Parameters<typeof finish>[0]): Program {
    const program = finish.call(this, result);
    const problems = checkProgram(program);
    if (problems.length > 0) throw new Error(`the IR checker refused a program just built: ${problems.join('; ')}`);
    return program;
  };
  ProgramBuilder.prototype.finish = Object.assign(checked, { checked: true });
}

// The planner's programs that carry tight enclosures are finished through finishMapped (the node map included).
const finishMapped = ProgramBuilder.prototype.finishMapped;
if (!(finishMapped as { checked?: boolean }).checked) {
  const checked = function (this: ProgramBuilder, result: Parameters<typeof finishMapped>[0]): ReturnType<typeof finishMapped> {
    const out = finishMapped.call(this, result);
    const problems = checkProgram(out.program);
    if (problems.length > 0) throw new Error(`the IR checker refused a program just built: ${problems.join('; ')}`);
    return out;
  };
  ProgramBuilder.prototype.finishMapped = Object.assign(checked, { checked: true });
}
