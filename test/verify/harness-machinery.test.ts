/**
 * The TypeScript and GLSL harnesses run the verifier's own code: their
 * machinery is generated from src/verify by scripts/gen-harness.js and
 * committed under templates/. Regenerating must give the committed files byte
 * for byte (as the golden samples do for emitted output), so a change to
 * src/verify that does not reach the harnesses fails here.
 */
import { describe, expect, test } from '@jest/globals';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { REPO_ROOT } from '../examples/support/repo.js';

interface Generated {
  readonly path: string;
  readonly text: string;
}
interface Generator {
  readonly generateMachinery: (overrides?: Readonly<Record<string, string>>) => Generated[];
}
/** A plain ES module beside the files it writes (imported by path, so the type check does not read it). */
const GENERATOR = '../../scripts/gen-harness.js';
const load = async (): Promise<Generator> => (await import(GENERATOR)) as Generator;

describe('the harness machinery generated from src/verify', () => {
  test('regenerating gives the committed files, byte for byte (run npm run gen:harness after changing src/verify)', async () => {
    const { generateMachinery } = await load();
    const files = generateMachinery();
    expect(files.map((f) => f.path).sort()).toEqual([
      'templates/glsl/check-machinery.js.hbs',
      'templates/ts/check-machinery.ts.hbs',
      'templates/ts/fixed-check-machinery.ts.hbs',
    ]);
    for (const f of files) {
      const committed = readFileSync(join(REPO_ROOT, f.path), 'utf8');
      if (committed !== f.text) throw new Error(`${f.path} is out of date: run npm run gen:harness and commit it`);
    }
  });

  test('a change to the verifier reaches the machinery (so the comparison above can fail)', async () => {
    const { generateMachinery } = await load();
    const path = 'src/verify/tally.ts';
    const source = readFileSync(join(REPO_ROOT, path), 'utf8');
    const changed = source.replace('if (exact === null || compareFractions(exact, boundExact) > 0) t.within = false;', 'if (exact === null) t.within = false;');
    expect(changed).not.toBe(source);
    const ts = generateMachinery({ [path]: changed }).find((f) => f.path === 'templates/ts/check-machinery.ts.hbs')!;
    expect(ts.text).toContain('if (exact === null) t.within = false;');
    expect(ts.text).not.toBe(readFileSync(join(REPO_ROOT, ts.path), 'utf8'));
  });

  test('what the machinery reaches must stay inside src/verify: a declaration from elsewhere is refused by name', async () => {
    const { generateMachinery } = await load();
    const path = 'src/verify/fraction.ts';
    const source = readFileSync(join(REPO_ROOT, path), 'utf8');
    const changed = source.replace(
      'export function mulFractions(a: Fraction, b: Fraction): Fraction {\n  return',
      'export function mulFractions(a: Fraction, b: Fraction): Fraction {\n  void Rational.ONE;\n  return',
    );
    expect(changed).not.toBe(source);
    expect(() => generateMachinery({ [path]: changed })).toThrow(/reaches Rational in src\/math\/rational\.ts/);
  });

  test('the machinery names the verifier functions the harnesses call, renamed rc_*, without exports', async () => {
    const { generateMachinery } = await load();
    const ts = generateMachinery().find((f) => f.path === 'templates/ts/check-machinery.ts.hbs')!.text;
    for (const name of ['rc_measurePoint', 'rc_bisectRoot', 'rc_visitSamplePoints', 'rc_tallyPoint', 'rc_summaryText', 'rc_formatG']) {
      expect(ts).toMatch(new RegExp(`^function ${name}\\(`, 'm'));
    }
    expect(ts).not.toMatch(/^export /m);
    expect(ts).not.toMatch(/\bimport\b/);
  });

  test('the fixed32 harness judges and samples with the verifier\'s own rule: the machinery holds it, the template ports none of it', async () => {
    const { generateMachinery } = await load();
    const fixed = generateMachinery().find((f) => f.path === 'templates/ts/fixed-check-machinery.ts.hbs')!.text;
    for (const name of ['rc_judgeFixedPoint', 'rc_tallyFixedPoint', 'rc_fixedSummaryText', 'rc_visitFixedSamplePoints', 'rc_bisectRoot']) {
      expect(fixed).toMatch(new RegExp(`^function ${name}\\(`, 'm'));
    }
    const template = readFileSync(join(REPO_ROOT, 'templates/ts/fixed-check.ts.hbs'), 'utf8');
    // No bisection, grid, xorshift or error rule of its own.
    expect(template).not.toMatch(/rc_bisectRoot|rc_midpoint|rc_referenceGridExponent|state << 13|rc_compareFractions/);
  });

  test('each emitted TypeScript harness declares an expression helper exactly when it calls it (generated-samples/)', () => {
    const folders = readdirSync(join(REPO_ROOT, 'generated-samples'));
    let checked = 0;
    for (const folder of folders) {
      for (const file of readdirSync(join(REPO_ROOT, 'generated-samples', folder)).filter((f) => f.endsWith('.check.ts'))) {
        const text = readFileSync(join(REPO_ROOT, 'generated-samples', folder, file), 'utf8');
        for (const helper of ['mulFractions', 'negFraction', 'powFraction']) {
          const declared = text.includes(`function rc_${helper}(`);
          const calls = text.split(`rc_${helper}(`).length - 1 - (declared ? 1 : 0);
          expect({ file, helper, declared }).toEqual({ file, helper, declared: calls > 0 });
        }
        checked++;
      }
    }
    expect(checked).toBeGreaterThanOrEqual(10);
  });
});
