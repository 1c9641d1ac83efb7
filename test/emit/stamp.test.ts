/**
 * The stamp line (src/emit/stamp.ts) that `emit --check` reads instead of
 * planning again, and the file names of src/emit/outputs.ts that it trusts:
 * they must be exactly the files emitFiles writes, each stamped with its role.
 * Content hashes are SHA-256 (FIPS 180-4), here node:crypto's.
 */
import { describe, expect, test } from '@jest/globals';
import { createHash } from 'node:crypto';
import { emitFiles } from '../../src/emit/files.js';
import { outputFiles, TARGETS } from '../../src/emit/outputs.js';
import { readStamp, sealStamp, stampLine } from '../../src/emit/stamp.js';
import { demoInput } from './support/family.js';
import { quadraticSeries } from './support/programs.js';

const SHA = 'ab'.repeat(32);

describe('stamp', () => {
  const text = `/*\n * ${stampLine('kiln.yaml', SHA, 'rootcast/9.9.9', { target: 'c', kind: 'function' })}\n */\nint x;\n`;
  const sealed = sealStamp(text);

  test('the content hash is the SHA-256 of the file without its stamp line', () => {
    const r = readStamp(sealed)!;
    expect(r.intact).toBe(true);
    expect(r.stamp).toEqual({ spec: 'kiln.yaml', specSha256: SHA, generator: 'rootcast/9.9.9', role: { target: 'c', kind: 'function' }, content: createHash('sha256').update('/*\n */\nint x;\n').digest('hex') });
  });

  test('an edit anywhere else is seen; a file without a stamp reads as null', () => {
    expect(readStamp(sealed.replace('int x;', 'int y;'))!.intact).toBe(false);
    expect(readStamp(`${sealed}\n`)!.intact).toBe(false);
    expect(readStamp('int x;\n')).toBeNull();
  });

  test('sealing twice is an error (the content field is filled once)', () => {
    expect(() => sealStamp(sealed)).toThrow(/already sealed/);
  });
});

describe('outputFiles names what emitFiles writes', () => {
  test.each([['float32'], ['float64']] as const)('%s: every target, with and without harnesses, each file stamped with its role and intact', (arithmetic) => {
    const input = demoInput(quadraticSeries(arithmetic).program, { arithmetic });
    for (const targets of [[...TARGETS], ['c'], ['ts'], ...(arithmetic === 'float32' ? [['glsl']] : [])] as (typeof TARGETS)[number][][]) {
      for (const harness of [true, false]) {
        const files = emitFiles(input, targets, { harness });
        const named = outputFiles(input.family.functionName, arithmetic, targets, harness);
        expect(files.map((f) => f.path)).toEqual(named.map((f) => f.path));
        files.forEach((f, i) => {
          const r = readStamp(f.text)!;
          expect(r.intact).toBe(true);
          expect(r.stamp.role).toEqual(named[i]!.role);
          expect(r.stamp.specSha256).toBe(input.family.specHash);
        });
      }
    }
  });
});
