/**
 * src/verify/branches.ts counts conditional branches, calls and jumps of one
 * function in objdump output, and finds them in code that has them: a
 * deliberately branchy C snippet compiled for x86-64 and for a Cortex-M4F
 * must show its loop branch and its call, and straight-line code none.
 * Mnemonics: x86 conditional jumps j<cc> and call (Intel SDM vol. 2, Jcc,
 * CALL); Arm b<cond>, cbz, cbnz, bl, blx (Arm v7-M ARM, A7.7); GNU objdump's
 * spelling of them is common practice (TOOLCHAIN.md).
 */
import { describe, expect, test } from '@jest/globals';
import { compileAndCount, countBranches, formatBranchLine, mnemonicOf } from '../../src/verify/branches.js';
import { countFixedCore, hasCore } from '../../src/verify/fixed-branches.js';

// Shaped like objdump -d --no-show-raw-insn output (real lines from gcc 12 and arm-none-eabi-gcc 12 objects).
const X86_DUMP = `
x.o:     file format elf64-x86-64


Disassembly of section .text:

0000000000000000 <other>:
   0:	call   5 <other+0x5>
   5:	ret

0000000000000010 <steps>:
  10:	xor    %eax,%eax
  12:	cmp    $0x1,%edi
  15:	je     2c <steps+0x1c>
  17:	nopw   0x0(%rax,%rax,1)
  20:	test   $0x1,%dil
  24:	jne    30 <steps+0x20>
  26:	call   2b <steps+0x1b>
  2b:	jmp    10 <steps>
  2c:	rep ret
  30:	notrack jmp *%rax
`;

const ARM_DUMP = `
w.o:     file format elf32-littlearm


Disassembly of section .text:

00000000 <probe>:
   0:	vldr	s15, [pc, #116]	@ 78 <probe+0x78>
   4:	vmul.f32	s0, s0, s15
   8:	cmp	r0, #1
   a:	beq.n	14 <probe+0x14>
   c:	cbz	r1, 16 <probe+0x16>
   e:	bl	0 <sqrtf>
  12:	ble.w	20 <probe+0x20>
  14:	blt	0 <probe>
  16:	b.n	0 <probe>
  18:	bx	lr
  1a:	nop
  1c:	.word	0x40395fae
`;

describe('countBranches', () => {
  test('x86-64: j<cc> are conditional, call is a call, jmp a jump; only the named function is read', () => {
    const c = countBranches(X86_DUMP, 'steps', 'x86-64');
    expect(c).toMatchObject({ instructions: 10, conditionalBranches: 2, calls: 1, jumps: 2 });
    expect(countBranches(X86_DUMP, 'other', 'x86-64')).toMatchObject({ instructions: 2, conditionalBranches: 0, calls: 1, jumps: 0 });
  });

  test('cortex-m4f: b<cond>, .n/.w forms and cbz are conditional; bl is a call; bx lr and literal words are not counted', () => {
    const c = countBranches(ARM_DUMP, 'probe', 'cortex-m4f');
    expect(c).toMatchObject({ instructions: 11, conditionalBranches: 4, calls: 1, jumps: 1 });
    expect(c.offending).toContain('e:\tbl\t0 <sqrtf>');
  });

  test('cortex-m0: a forward b.n past a literal pool (only words and an alignment nop between) is a pool jump, not a jump; other b.n are jumps', () => {
    // Lines of arm-none-eabi-gcc 12's -O2 Cortex-M0 code for a long straight-line function (a Pt1000 fixed32 plan of degree 9).
    const dump = [
      '',
      '00000000 <rc_probe>:',
      ' 3f6:\tadd\tr4, ip',
      ' 3f8:\tb.n\t404 <rc_probe+0x404>',
      ' 3fa:\tnop\t\t\t@ (mov r8, r8)',
      ' 3fc:\t.word\t0xf66b970a',
      ' 400:\t.word\t0x0000eaa0',
      ' 404:\tlsls\tr5, r4, #16',
      ' 406:\tb.n\t40c <rc_probe+0x40c>',
      ' 408:\tmuls\tr5, r2',
      ' 40a:\t.word\t0x00004cf8',
      ' 40c:\tb.n\t410 <rc_probe+0x410>',
      ' 40e:\tnop',
      ' 410:\tb.n\t3f6 <rc_probe+0x3f6>',
      ' 412:\tbx\tlr',
      '',
    ].join('\n');
    const c = countBranches(dump, 'rc_probe', 'cortex-m4f');
    // The pool jump at 3f8 skips a nop and two words; 406 skips an instruction, 40c no word, 410 goes back.
    expect(c).toMatchObject({ instructions: 9, conditionalBranches: 0, calls: 0, jumps: 3, poolJumps: 1 });
    expect(c.offending).toEqual(['406:\tb.n\t40c <rc_probe+0x40c>', '40c:\tb.n\t410 <rc_probe+0x410>', '410:\tb.n\t3f6 <rc_probe+0x3f6>']);
  });

  test('mnemonics skip x86 prefixes and ignore data words', () => {
    expect(mnemonicOf('  2c:\trep ret', 'x86-64')).toBe('ret');
    expect(mnemonicOf('  1c:\t.word\t0x40395fae', 'cortex-m4f')).toBeNull();
  });

  test('a function that is not in the disassembly is an error, not zero branches', () => {
    expect(() => countBranches(X86_DUMP, 'missing', 'x86-64')).toThrow(/function missing not found/);
  });

  test('the verify line names both targets and says FAIL when any is found', () => {
    const clean = { instructions: 9, conditionalBranches: 0, calls: 0, jumps: 0, poolJumps: 0, offending: [] };
    const line = formatBranchLine('f', [
      { target: 'x86-64', count: clean },
      { target: 'cortex-m4f', count: { ...clean, calls: 1 } },
    ]);
    expect(line).toBe('branches f: x86-64 gcc -O2: 0 conditional branches, 0 calls; cortex-m4f arm-none-eabi-gcc -O2: 0, 1 FAIL');
    // A jump past a literal pool is named and does not fail the line.
    expect(formatBranchLine('f', [{ target: 'x86-64', count: clean }, { target: 'cortex-m4f', count: { ...clean, poolJumps: 2 } }])).toBe(
      'branches f: x86-64 gcc -O2: 0 conditional branches, 0 calls; cortex-m4f arm-none-eabi-gcc -O2: 0, 0, 2 jumps past a literal pool (taken every call) PASS',
    );
  });
});

// A loop with a data-dependent exit (the Collatz step count) and a call that
// is not a tail call: both targets must show at least one of each.
const BRANCHY = `
extern float ext(float);
int steps(int n);
int steps(int n) { int k = 0; while (n != 1) { n = (n & 1) ? 3 * n + 1 : n / 2; k++; } return k; }
float calls(float x);
float calls(float x) { return ext(x) * 2.0f; }
float line(float x);
float line(float x) { return (x * 3.0f + 1.0f) * x; }
`;

describe.each(['x86-64', 'cortex-m4f'] as const)('compiled code on %s', (target) => {
  test('the loop has a conditional branch', () => {
    expect(compileAndCount(BRANCHY, 'steps', target).conditionalBranches).toBeGreaterThanOrEqual(1);
  });
  test('the call is counted', () => {
    expect(compileAndCount(BRANCHY, 'calls', target).calls).toBeGreaterThanOrEqual(1);
  });
  test('straight-line code has none', () => {
    const c = compileAndCount(BRANCHY, 'line', target);
    expect(c.instructions).toBeGreaterThan(1);
    expect(c).toMatchObject({ conditionalBranches: 0, calls: 0, jumps: 0 });
  });
});

// 200 multiply-adds with distinct 32-bit constants: Thumb-1 loads each from a
// literal pool within 1020 bytes of the load, so gcc places pools inside the
// function and jumps past them (the Cortex-M0's instruction set, Armv6-M).
const LONG = [
  '#include <stdint.h>',
  'static inline int32_t poolfn(int32_t x)',
  '{',
  ...Array.from({ length: 200 }, (_, i) => `    x = (int32_t)((uint32_t)x * ${(0x9e3779b1 * (i + 1)) % 2 ** 32 | 1}u + ${(0x7f4a7c15 * (i + 3)) % 2 ** 32}u);`),
  '    return x;',
  '}',
  '',
].join('\n');

describe('a long Cortex-M0 function with mid-function literal pools', () => {
  test('its jumps past the pools are counted apart, and it has no other branch, call or jump', () => {
    if (!hasCore('cortex-m0')) throw new Error('arm-none-eabi-gcc is missing (apt-get install gcc-arm-none-eabi)');
    const c = countFixedCore({ path: 'long.h', text: LONG }, 'poolfn', 1, 'cortex-m0');
    expect(c.poolJumps).toBeGreaterThanOrEqual(1);
    expect(c).toMatchObject({ conditionalBranches: 0, calls: 0, jumps: 0, offending: [] });
  });
});
