/**
 * Behaviours of rootcast 0.1.0 that break the promise "bad input gets one
 * clear line (file, line, column, field, what to change), exit code 2, and
 * nothing written", found by these tests and reported to the lead.
 *
 * Each is written as the test it should pass and marked `test.failing`, so the
 * suite stays green while the bug is there and turns red the day it is fixed:
 * then remove `.failing` and the test keeps the fix.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ensureBuilt, expectRefusal, expectSpecRefusal, listFiles, removeTempDirs, runMany, tempDir, type CliRun } from './run-cli.js';

const edge = (file: string): string => `test/fixtures/edge/${file}`;

// Every run is independent: start them all at once (a few at a time).
const dirs = new Map<string, string>();
let runs: Record<'badTarget' | 'newOut' | 'outFile' | 'divZero' | 'pole' | 'poleAtCentre' | 'bigRoot', CliRun>;

/**
 * pole-in-box.yaml with the pole moved to the box centre, R = 245.245 (the
 * midpoint of [100, 390.49]), where the bracketed root is found first.
 */
const POLE_AT_CENTRE = readFileSync(edge('pole-in-box.yaml'), 'utf8').replace('2: B / (R - 200)', '2: B / (R - 245.245)');

beforeAll(async () => {
  ensureBuilt();
  for (const k of ['newOut', 'outFile', 'bigRoot', 'poleAtCentre']) dirs.set(k, tempDir(k));
  writeFileSync(join(dirs.get('outFile')!, 'not-a-dir'), 'keep me\n');
  writeFileSync(join(dirs.get('poleAtCentre')!, 'pole-at-centre.yaml'), POLE_AT_CENTRE);
  const [badTarget, newOut, outFile, divZero, pole, poleAtCentre, bigRoot] = await runMany([
    { args: ['emit', 'examples/kiln-probe.yaml', '--target', 'fortran', '--out', join(tempDir('bad-target'), 'out')] },
    { args: ['new', 'spring_gauge', '--out', 'no-such-dir/spring.yaml'], cwd: dirs.get('newOut')! },
    { args: ['emit', 'examples/kiln-probe.yaml', '--target', 'c', '--out', join(dirs.get('outFile')!, 'not-a-dir')] },
    { args: ['plan', edge('division-by-zero-expression.yaml')] },
    { args: ['plan', edge('pole-in-box.yaml')] },
    { args: ['plan', 'pole-at-centre.yaml'], cwd: dirs.get('poleAtCentre')! },
    { args: ['emit', edge('root-beyond-float32.yaml'), '--target', 'c', '--out', join(dirs.get('bigRoot')!, 'out')] },
  ]);
  runs = { badTarget: badTarget!, newOut: newOut!, outFile: outFile!, divZero: divZero!, pole: pole!, poleAtCentre: poleAtCentre!, bigRoot: bigRoot! };
});
afterAll(removeTempDirs);

describe('usage errors that are not one plain line', () => {
  // src/cli/main.ts prints yargs' "Invalid values:\n  Argument: target, ..." message
  // as it is: two lines on stderr.
  test('an invalid --target choice exits 2 with one line', () => {
    expect(expectRefusal(runs.badTarget)).toContain('fortran');
  });

  // src/cli/commands/new.ts: writeFileSync's ENOENT escapes runNew and reaches
  // the "internal error" handler of src/cli.ts.
  test('new --out into a directory that does not exist is refused in plain words', () => {
    expect(expectRefusal(runs.newOut)).not.toContain('internal error');
    expect(listFiles(dirs.get('newOut')!)).toEqual([]);
  });

  // src/cli/files.ts writeFiles: mkdirSync(recursive) throws EEXIST when --out
  // is an existing regular file; reported as "internal error".
  test('emit --out naming an existing file is refused in plain words and the file is left alone', () => {
    expect(expectRefusal(runs.outFile)).not.toContain('internal error');
    expect(readFileSync(join(dirs.get('outFile')!, 'not-a-dir'), 'utf8')).toBe('keep me\n');
  });
});

describe('specs that get an internal error or the wrong field', () => {
  test('a division by an expression that is zero for every input is refused at its coefficient', () => {
    const line = expectSpecRefusal(runs.divZero);
    expect(line.field).toBe('coefficients.2');
    expect(line.line).toBe(9);
  });

  // Fixed: src/plan/refusals.ts names the coefficient whose division can be by
  // zero (src/plan/coefficient-poles.ts) before it speaks of the slope.
  test('a division by zero inside the box (a pole at R = 200) is refused at its coefficient, not as a vanishing slope', () => {
    const line = expectSpecRefusal(runs.pole);
    // Line 10 is `  2: B / (R - 200)`; column 8 is its `/`.
    expect({ field: line.field, line: line.line, column: line.column }).toEqual({ field: 'coefficients.2', line: 10, column: 8 });
    expect(line.message).toMatch(/^coefficient 2 can be unbounded for R in \[[^\]]+\]: it divides by `R - 200`, which can be zero there; narrow the input range or rewrite the expression$/);
    expect(line.message).not.toContain('slope');
    // The named region holds the pole: R - 200 = 0 at R = 200.
    const [lo, hi] = /R in \[([^,]+), ([^\]]+)\]/.exec(line.message)!.slice(1).map(Number);
    expect(lo! <= 200 && 200 <= hi!).toBe(true);
  });

  // src/plan/root-choice.ts rootAt evaluates the coefficients exactly at the box
  // centre to find x0 in the bracket; Rational.div's "division by zero" there
  // escapes as "internal error" before the cells are looked at.
  test('a pole at the box centre (with root.bracket) is refused at its coefficient, not as an internal error', () => {
    const line = expectSpecRefusal(runs.poleAtCentre);
    expect(line.field).toBe('coefficients.2');
    expect(line.message).toContain('divides by `R - 245.245`');
  });

  test('a root beyond the float32 range is refused in one located line', () => {
    const line = expectSpecRefusal(runs.bigRoot);
    expect(line.message).toContain('float32');
    expect(listFiles(join(dirs.get('bigRoot')!, 'out'))).toEqual([]);
  });
});
