/**
 * The layering as data: every import in src/ points down the stage order
 * (DEVELOPERS.md, "Where things live"), so data flows one way and a stage
 * can be read without the ones above it. Imports are read by the TypeScript
 * compiler's own pre-processor (ts.preProcessFile), static, re-exported and
 * dynamic ones alike; a failure names the file, the line and both stages.
 */
import { describe, expect, test } from '@jest/globals';
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import ts from 'typescript';

/** Top to bottom: a file may import its own stage and the stages below it. */
const STAGES = ['cli', 'reader', 'verify', 'emit', 'plan', 'ir', 'series', 'family', 'math'] as const;
/** Files directly in src/ and the stage they belong to; errors.ts and package-root.ts are shared by every stage. */
const ROOT_FILES: Readonly<Record<string, string>> = { 'cli.ts': 'cli', 'launch.ts': 'cli', 'version.ts': 'cli', 'errors.ts': 'shared', 'package-root.ts': 'shared' };

const SRC = resolve('src');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(p);
    return e.name.endsWith('.ts') ? [p] : [];
  });
}

/** The stage of a file under src/, or null when it belongs to none (a new folder must be placed in STAGES). */
function stageOf(file: string): string | null {
  const rel = relative(SRC, file).split('\\').join('/');
  if (!rel.includes('/')) return ROOT_FILES[rel] ?? null;
  const top = rel.split('/')[0]!;
  return (STAGES as readonly string[]).includes(top) ? top : null;
}

interface Edge {
  readonly file: string;
  readonly line: number;
  readonly target: string;
}

function importsOf(file: string, text: string): Edge[] {
  const info = ts.preProcessFile(text, true, true);
  return info.importedFiles
    .filter((f) => f.fileName.startsWith('.'))
    .map((f) => ({
      file,
      line: text.slice(0, f.pos).split('\n').length,
      target: resolve(dirname(file), f.fileName.replace(/\.js$/, '.ts')),
    }));
}

/** The imports that point up the order (or out of it), one line each. */
function layeringProblems(files: readonly string[], read: (file: string) => string = (f) => readFileSync(f, 'utf8')): string[] {
  const rank = (s: string): number => (s === 'shared' ? Infinity : STAGES.indexOf(s as (typeof STAGES)[number]));
  const problems: string[] = [];
  for (const file of files) {
    const from = stageOf(file);
    const where = relative(process.cwd(), file);
    if (from === null) {
      problems.push(`${where}: in no stage; add its folder to the stage order (DEVELOPERS.md and test/layout/layering.test.ts)`);
      continue;
    }
    for (const e of importsOf(file, read(file))) {
      const to = stageOf(e.target);
      const target = relative(process.cwd(), e.target);
      if (to === null) problems.push(`${where}:${e.line}: imports ${target}, which is in no stage`);
      else if (from === 'shared' && to !== 'shared') problems.push(`${where}:${e.line}: the shared errors module imports ${target} (${to})`);
      else if (rank(to) < rank(from)) problems.push(`${where}:${e.line}: ${from} imports ${target}, in ${to}, which is above it (order: ${STAGES.join(' → ')})`);
    }
  }
  return problems;
}

describe('layering: imports point down cli → reader → verify → emit → plan → ir → series → family → math', () => {
  const files = sourceFiles(SRC);

  test('the source tree has files in every stage', () => {
    for (const s of STAGES) expect(files.some((f) => stageOf(f) === s)).toBe(true);
  });

  test('no import in src/ points up the order', () => {
    expect(layeringProblems(files)).toEqual([]);
  });

  test('an upward import is caught with its file and line (a planted file, read from memory)', () => {
    const planted = join(SRC, 'math', 'planted.ts');
    const text = "/** A planted file. */\nimport { makePlan } from '../plan/plan.js';\nexport { RootcastError } from '../errors.js';\n";
    expect(layeringProblems([planted], () => text)).toEqual([
      'src/math/planted.ts:2: math imports src/plan/plan.ts, in plan, which is above it (order: cli → reader → verify → emit → plan → ir → series → family → math)',
    ]);
    const dynamic = "const m = await import('../cli/main.js');\n";
    expect(layeringProblems([join(SRC, 'ir', 'planted.ts')], () => dynamic)).toEqual([
      'src/ir/planted.ts:1: ir imports src/cli/main.ts, in cli, which is above it (order: cli → reader → verify → emit → plan → ir → series → family → math)',
    ]);
  });

  test.each(['DEVELOPERS.md', 'docs/DESIGN.md'])('%s states the same order, and no other', (doc) => {
    const text = readFileSync(doc, 'utf8');
    expect(text).toContain(STAGES.join(' → '));
    // Every chain from the top stage down in the page (a stale copy of the order would be a second one).
    const chains = text.match(/\bcli(?: → [a-z]+)+/g) ?? [];
    expect(new Set(chains)).toEqual(new Set([STAGES.join(' → ')]));
  });
});
