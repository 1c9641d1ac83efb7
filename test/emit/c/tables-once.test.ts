/**
 * Lean tables in C (issue 11): a segmented header keeps its tables at file
 * scope and, with gcc, as weak definitions, so a program whose translation
 * units all include the header holds one copy of each table. The check reads
 * the linked program's symbol table with nm (GNU binutils): each table is
 * one symbol there, where `static const` tables would be one local symbol
 * per translation unit. The two units' results agree with each other bit for
 * bit (the same function reads the same table).
 */
import { afterAll, describe, expect, test } from '@jest/globals';
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import { cFunction } from '../../../src/emit/c/function.js';
import { cTableName } from '../../../src/emit/c/body.js';
import { segmentedProgram } from '../../glsl/support/segmented.js';
import { demoInput } from '../support/family.js';
import { gcc } from '../../support/run-c.js';
import { makeWorkDir } from '../../support/workdir.js';

const dir = makeWorkDir('c-tables-once');
afterAll(() => dir.remove());

describe('C tables are stored once per program', () => {
  test('two translation units that call the function link to one copy of each table', () => {
    const { program } = segmentedProgram();
    const name = 'lean_demo';
    const header = cFunction(demoInput(program, { functionName: name }));
    const tables = program.nodes.flatMap((n, i) => (n.kind === 'table' ? [cTableName(name, i)] : []));
    expect(tables.length).toBeGreaterThan(1);
    // The tables sit before the function, outside it.
    const fnAt = header.text.indexOf(`static inline float ${name}(`);
    for (const t of tables) expect(header.text.indexOf(`${t}[`)).toBeLessThan(fnAt);
    dir.write(header.path, header.text);
    const args = program.inputs.map(() => 'x').join(', ');
    dir.write('a.c', `#include "${header.path}"\nfloat call_a(float x);\nfloat call_a(float x) { return ${name}(${args}); }\n`);
    dir.write('b.c', `#include "${header.path}"\nfloat call_b(float x);\nfloat call_b(float x) { return ${name}(${args}); }\n`);
    dir.write(
      'main.c',
      `#include <stdio.h>\nfloat call_a(float x);\nfloat call_b(float x);\nint main(void) {\n  int bad = 0;\n  for (int i = 0; i <= 64; i++) { float x = -1.0f + i / 16.0f; if (call_a(x) != call_b(x)) bad++; }\n  printf("%d\\n", bad);\n  return 0;\n}\n`,
    );
    gcc(dir, ['-c', 'a.c', '-o', 'a.o']);
    gcc(dir, ['-c', 'b.c', '-o', 'b.o']);
    gcc(dir, ['main.c', 'a.o', 'b.o', '-o', 'prog']);
    // Each unit defines every table it reads...
    for (const obj of ['a.o', 'b.o']) {
      const syms = execFileSync('nm', [join(dir.path, obj)], { encoding: 'utf8' });
      for (const t of tables) expect(syms.split('\n').filter((l) => l.endsWith(` ${t}`)).length).toBe(1);
    }
    // ...and the program keeps one.
    const linked = execFileSync('nm', [join(dir.path, 'prog')], { encoding: 'utf8' }).split('\n');
    for (const t of tables) expect(linked.filter((l) => l.endsWith(` ${t}`)).length).toBe(1);
    expect(execFileSync(join(dir.path, 'prog'), { encoding: 'utf8' }).trim()).toBe('0');
  });
});
