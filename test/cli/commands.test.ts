/**
 * The command line itself, through the built CLI: help, bad usage, a missing
 * spec, and `new` (writes a starter that plans, never overwrites, refuses a
 * keyword). Exit codes follow DESIGN.md section 4: 0 success, 2 bad spec,
 * bad usage or an impossible plan, always with one line on stderr.
 *
 * The runs are independent processes, so they all start in beforeAll (a few
 * at a time) and the tests read their results.
 */
import { afterAll, beforeAll, describe, expect, test } from '@jest/globals';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ensureBuilt, expectRefusal, expectSpecRefusal, listFiles, removeTempDirs, runCli, runMany, tempDir, type CliRun } from './run-cli.js';

const KEYWORDS = [
  ['double', 'C'],
  ['function', 'TypeScript'],
  ['vec3', 'GLSL'],
] as const;

const USAGE = {
  help: ['--help'],
  unknownCommand: ['frobnicate'],
  unknownOption: ['plan', 'examples/kiln-probe.yaml', '--bogus'],
  noSpec: ['plan'],
  noCommand: [],
  noOut: ['emit', 'examples/kiln-probe.yaml'],
  zeroSamples: ['verify', 'examples/kiln-probe.yaml', '--target', 'c', '--samples', '0'],
  negativeSeed: ['verify', 'examples/kiln-probe.yaml', '--target', 'c', '--seed', '-1'],
} as const;
type UsageCase = keyof typeof USAGE;

/** `new spring_gauge` in an empty directory, then plan it, then `new` again over an edited file. */
interface NewStory {
  cwd: string;
  made: CliRun;
  filesAfterNew: string[];
  starter: string;
  plan: CliRun;
  again: CliRun;
  afterAgain: string;
  filesAfterAgain: string[];
}

async function newStory(): Promise<NewStory> {
  const cwd = tempDir('new');
  const made = await runCli(['new', 'spring_gauge'], cwd);
  const filesAfterNew = listFiles(cwd);
  const starter = filesAfterNew.includes('spring_gauge.yaml') ? readFileSync(join(cwd, 'spring_gauge.yaml'), 'utf8') : '';
  const plan = await runCli(['plan', 'spring_gauge.yaml', '--json'], cwd);
  // The user edits the file; a second `new` must leave it alone.
  writeFileSync(join(cwd, 'spring_gauge.yaml'), `${starter}# edited\n`);
  const again = await runCli(['new', 'spring_gauge'], cwd);
  return { cwd, made, filesAfterNew, starter, plan, again, afterAgain: readFileSync(join(cwd, 'spring_gauge.yaml'), 'utf8'), filesAfterAgain: listFiles(cwd) };
}

const usage = new Map<UsageCase, CliRun>();
const keyword = new Map<string, { run: CliRun; cwd: string }>();
let missingPlan: { run: CliRun; cwd: string };
let missingEmit: { run: CliRun; cwd: string };
let story: NewStory;

beforeAll(async () => {
  ensureBuilt();
  const usageCases = Object.keys(USAGE) as UsageCase[];
  const keywordDirs = KEYWORDS.map(() => tempDir('new-bad'));
  const missingDirs = [tempDir('missing'), tempDir('missing-emit')];
  const [runs, s] = await Promise.all([
    runMany([
      ...usageCases.map((k) => ({ args: [...USAGE[k]] })),
      ...KEYWORDS.map(([name], i) => ({ args: ['new', name], cwd: keywordDirs[i]! })),
      { args: ['plan', 'no-such-spec.yaml'], cwd: missingDirs[0]! },
      { args: ['emit', 'no-such-spec.yaml', '--out', 'out'], cwd: missingDirs[1]! },
    ], 2),
    newStory(),
  ]);
  usageCases.forEach((k, i) => usage.set(k, runs[i]!));
  KEYWORDS.forEach(([name], i) => keyword.set(name, { run: runs[usageCases.length + i]!, cwd: keywordDirs[i]! }));
  missingPlan = { run: runs[usageCases.length + KEYWORDS.length]!, cwd: missingDirs[0]! };
  missingEmit = { run: runs[usageCases.length + KEYWORDS.length + 1]!, cwd: missingDirs[1]! };
  story = s;
});
afterAll(removeTempDirs);

describe('help and bad usage', () => {
  test('--help lists the four commands and exits 0', () => {
    const r = usage.get('help')!;
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    for (const cmd of ['new <name>', 'plan <specs..>', 'emit <specs..>', 'verify <specs..>']) expect(r.stdout).toContain(`rootcast ${cmd}`);
  });

  test('an unknown command, an unknown option, a missing argument or no command exits 2 with one line', () => {
    expect(expectRefusal(usage.get('unknownCommand')!)).toContain('frobnicate');
    expect(expectRefusal(usage.get('unknownOption')!)).toContain('bogus');
    expect(expectRefusal(usage.get('noSpec')!)).toMatch(/^rootcast: /);
    expect(expectRefusal(usage.get('noCommand')!)).toContain('new, plan, emit or verify');
    expect(expectRefusal(usage.get('noOut')!)).toContain('out');
  });

  test('verify refuses --samples 0 and a negative --seed in one line', () => {
    expect(expectRefusal(usage.get('zeroSamples')!)).toContain('--samples');
    expect(expectRefusal(usage.get('negativeSeed')!)).toContain('--seed');
  });

  test('a missing spec file exits 2 with one located line, for plan and for emit, and nothing is written', () => {
    for (const { run, cwd } of [missingPlan, missingEmit]) {
      const line = expectSpecRefusal(run);
      expect(line.file).toBe('no-such-spec.yaml');
      expect(line.message).toContain('no such file');
      expect(listFiles(cwd)).toEqual([]);
    }
  });
});

describe('rootcast new NAME', () => {
  test('writes NAME.yaml (and nothing else) in the working directory', () => {
    expect(story.made.stderr).toBe('');
    expect(story.made.code).toBe(0);
    expect(story.filesAfterNew).toEqual(['spring_gauge.yaml']);
    expect(story.starter).toMatch(/^function: spring_gauge$/m);
  });

  test('the starter plans successfully and meets its own target', () => {
    expect(story.plan.stderr).toBe('');
    expect(story.plan.code).toBe(0);
    const p = JSON.parse(story.plan.stdout) as { function: string; bound: { total: number }; target: number };
    expect(p.function).toBe('spring_gauge');
    expect(p.bound.total).toBeLessThanOrEqual(p.target);
  });

  test('a second new refuses to overwrite, in one line, and leaves the edited file as it was', () => {
    expect(expectRefusal(story.again)).toContain('already exists');
    expect(story.afterAgain).toBe(`${story.starter}# edited\n`);
    expect(story.filesAfterAgain).toEqual(['spring_gauge.yaml']);
  });

  test.each(KEYWORDS)('refuses the keyword %s (%s) in one line and writes nothing', (name, phrase) => {
    const { run, cwd } = keyword.get(name)!;
    const line = expectRefusal(run);
    expect(line).toContain(`\`${name}\``);
    expect(line).toContain(phrase);
    expect(listFiles(cwd)).toEqual([]);
  });
});
