/**
 * The numeric contract, once: the arithmetics the emitted code computes in,
 * as one literal union with one row of facts each. Every stage reads this
 * table instead of comparing names; a new arithmetic is one row here, and the
 * compiler then lists every place that must learn about it.
 *
 * | arithmetic | kind  | p  | u = 2^-p | smallest subnormal | largest finite       | bytes | C      | GLSL  | TS rounding | segment magic 1.5 * 2^(p-1) |
 * |------------|-------|----|----------|--------------------|----------------------|-------|--------|-------|-------------|-----------------------------|
 * | float32    | float | 24 | 2^-24    | 2^-149             | (2 - 2^-23) * 2^127  | 4     | float  | float | Math.fround | 12582912 = 1.5 * 2^23       |
 * | float64    | float | 53 | 2^-53    | 2^-1074            | (2 - 2^-52) * 2^1023 | 8     | double | none  | none        | 6755399441055744 = 1.5 * 2^52 |
 *
 * WGSL, HLSL and Rust types: f32 / none / f32 for float32 and none / none /
 * f64 for float64 (WGSL has f16 and f32 only, W3C WGSL "Floating Point Types";
 * HLSL is emitted in binary32 only; Rust's f32 and f64 are binary32 and
 * binary64, The Rust Reference "Numeric types").
 *
 * Source: IEEE 754-2019, table 3.5 (binary32, binary64 parameters); GLSL ES
 * 3.00 has no double type (GLSL ES 3.00.6, section 4.1); both from memory.
 *
 * The arithmetics a spec can name are the rows of SPEC_ARITHMETICS: the two
 * float rows above, and fixed32 with `kind: 'fixed'` (DESIGN.md 1.12; int32
 * values with per-value binary points, 32 x 32 -> 64-bit products). A fixed
 * row carries its integer types per target and no float-only facts; its
 * `planningArithmetic` is the float arithmetic the planner's float stages
 * (root choice, segment centres) work in, which a fixed32 family carries as
 * its `arithmetic` (src/family/types.ts, FixedFormat). Code that handles the
 * spec's arithmetic reads `arithmeticFacts(name)` and narrows on `kind`.
 */
import { nextDown, nextUp, type Rational } from '../math/rational.js';

/** The float arithmetics: what an IR program computes in (src/ir/nodes.ts). */
export type Arithmetic = 'float32' | 'float64';

/** Every arithmetic a spec can name: the float ones, then fixed32. */
export type ArithmeticName = Arithmetic | 'fixed32';

/** The cost models the planner can rank by (one row each in src/ir/cost/index.ts). */
export type CostModelName = 'cortex-m4f' | 'x86-64' | 'gpu';

/** The facts of a binary floating-point arithmetic (IEEE 754 binary32 or binary64). */
export interface FloatFacts {
  readonly kind: 'float';
  /** Significand bits p, the hidden bit included. */
  readonly significandBits: number;
  /** Unit roundoff for round-to-nearest: half an ulp of 1, relative (2^-p). */
  readonly u: number;
  readonly minSubnormal: number;
  readonly minNormal: number;
  readonly maxFinite: number;
  /** Bytes per stored value (table sizes). */
  readonly bytes: number;
  /** The C type of a value, and the unsigned integer of the same width (the segment index reads the bits through a union). */
  readonly cType: 'float' | 'double';
  readonly cBitsType: 'uint32_t' | 'uint64_t';
  /** The GLSL ES 3.00 type, or null: GLSL ES has no double, so no GLSL is emitted. */
  readonly glslType: 'float' | null;
  /** The WGSL and HLSL scalar types, or null: WGSL has no 64-bit float, and rootcast emits HLSL in binary32 only. */
  readonly wgslType: 'f32' | null;
  readonly hlslType: 'float' | null;
  /** The Rust type, and the unsigned integer of the same width (to_bits reads the segment index). */
  readonly rustType: 'f32' | 'f64';
  readonly rustBitsType: 'u32' | 'u64';
  /**
   * The TypeScript function that rounds a binary64 result to this arithmetic
   * (every JS number is binary64), or null when none is needed. Math.fround
   * after one +, -, *, / of binary32 operands is the correctly rounded
   * binary32 result, because 53 >= 2 * 24 + 2 (double rounding is innocuous).
   */
  readonly tsRound: 'Math.fround' | null;
  /** Rounds a JS number (one IEEE operation's binary64 result) to this arithmetic. */
  readonly roundNumber: (x: number) => number;
  /** Rounds an exact value to the nearest value of this arithmetic (ties to even). */
  readonly roundExact: (x: Rational) => number;
  /**
   * SEGMENT INDEX's magic constant M = 1.5 * 2^(p-1): t + M, for |t| < 2^(p-2),
   * rounds t to the nearest integer and leaves it in the low bits (src/ir/nodes.ts).
   */
  readonly segmentMagic: number;
  /**
   * How SEGMENT INDEX reads the rounded integer from the bits of t + M:
   * 'significand', (bits & (2^(p-1) - 1)) - 2^(p-2) (the whole word is 32
   * bits); 'low-word', the low 32 bits as a signed integer.
   */
  readonly segmentRead: 'significand' | 'low-word';
  /**
   * Bounds allow for flushed subnormal results as well: GPUs may flush
   * binary32 subnormals to zero (GLSL ES 3.00 does not require them; common
   * practice), so one bound holds on CPUs and GPUs.
   */
  readonly boundsAllowFlush: boolean;
  /** A Cortex-M4F computes it in hardware (its FPU is single precision only; binary64 is a software library there). */
  readonly m4fHardware: boolean;
  /** The cost model the planner ranks plans by and the header prints (src/ir/cost/index.ts). */
  readonly costModel: CostModelName;
  /** The wider arithmetic a refusal suggests (range or rounding floor), or null for the widest. */
  readonly wider: Arithmetic | null;
}

export type ArithmeticFacts = FloatFacts;

export const ARITHMETICS: Readonly<Record<Arithmetic, ArithmeticFacts>> = {
  float32: {
    kind: 'float',
    significandBits: 24,
    u: 2 ** -24,
    minSubnormal: 2 ** -149,
    minNormal: 2 ** -126,
    maxFinite: (2 - 2 ** -23) * 2 ** 127,
    bytes: 4,
    cType: 'float',
    cBitsType: 'uint32_t',
    glslType: 'float',
    wgslType: 'f32',
    hlslType: 'float',
    rustType: 'f32',
    rustBitsType: 'u32',
    tsRound: 'Math.fround',
    roundNumber: Math.fround,
    roundExact: (x) => x.toFloat32(),
    segmentMagic: 12582912,
    segmentRead: 'significand',
    boundsAllowFlush: true,
    m4fHardware: true,
    costModel: 'cortex-m4f',
    wider: 'float64',
  },
  float64: {
    kind: 'float',
    significandBits: 53,
    u: 2 ** -53,
    minSubnormal: 2 ** -1074,
    minNormal: 2 ** -1022,
    maxFinite: Number.MAX_VALUE,
    bytes: 8,
    cType: 'double',
    cBitsType: 'uint64_t',
    glslType: null,
    wgslType: null,
    hlslType: null,
    rustType: 'f64',
    rustBitsType: 'u64',
    tsRound: null,
    roundNumber: (x) => x,
    roundExact: (x) => x.toNumber(),
    segmentMagic: 6755399441055744,
    segmentRead: 'low-word',
    boundsAllowFlush: false,
    m4fHardware: false,
    costModel: 'x86-64',
    wider: null,
  },
};

/**
 * The facts of a fixed-point arithmetic: two's complement words with a
 * binary point chosen per value (DESIGN.md 1.12). Sources: ISO C99 7.18.1.1
 * (int32_t, int64_t: exact width, two's complement, no padding); The Rust
 * Reference "Numeric types" (i32, i64); ECMAScript 2022 sections 7.1.6
 * (ToInt32, what `| 0` computes) and 21.2 (BigInt). All from memory.
 */
export interface FixedFacts {
  readonly kind: 'fixed';
  /** Bits per value, and per product before it is shifted back. */
  readonly wordBits: 32;
  readonly productBits: 64;
  /** Bytes per stored value (table sizes). */
  readonly bytes: 4;
  /** The C types of a value and of a product. */
  readonly cType: 'int32_t';
  readonly cWideType: 'int64_t';
  /** No shader target: shaders run on hardware with floating point, and fixed point is for cores without an FPU. */
  readonly glslType: null;
  readonly wgslType: null;
  readonly hlslType: null;
  /** The Rust types of a value and of a product. */
  readonly rustType: 'i32';
  readonly rustWideType: 'i64';
  /** How TypeScript holds a value: an int32 in a number (`| 0`), products in BigInt. */
  readonly tsType: 'number';
  /** The float arithmetic the planner's float stages work in for this arithmetic (the family's `arithmetic`). */
  readonly planningArithmetic: Arithmetic;
  /** The core the planner ranks segment counts for and the header's cost lines and `plan` describe: no FPU, Armv6-M timings (src/ir/cost/cortex-m0.ts). */
  readonly costCore: 'cortex-m0';
}

export const FIXED32: FixedFacts = {
  kind: 'fixed',
  wordBits: 32,
  productBits: 64,
  bytes: 4,
  cType: 'int32_t',
  cWideType: 'int64_t',
  glslType: null,
  wgslType: null,
  hlslType: null,
  rustType: 'i32',
  rustWideType: 'i64',
  tsType: 'number',
  planningArithmetic: 'float64',
  costCore: 'cortex-m0',
};

/** Every arithmetic a spec can name, in the order the reader lists them. */
export const SPEC_ARITHMETICS: Readonly<Record<ArithmeticName, FloatFacts | FixedFacts>> = {
  float32: ARITHMETICS.float32,
  float64: ARITHMETICS.float64,
  fixed32: FIXED32,
};

export function arithmeticFacts(name: ArithmeticName): FloatFacts | FixedFacts {
  return SPEC_ARITHMETICS[name];
}

/** The value nearest to `exact` in the target arithmetic (round to nearest, ties to even). */
export function roundTo(exact: Rational, arithmetic: Arithmetic): number {
  return ARITHMETICS[arithmetic].roundExact(exact);
}

/** Rounds a JS number to the target arithmetic, as one IEEE operation would. */
export function roundNumber(x: number, arithmetic: Arithmetic): number {
  return ARITHMETICS[arithmetic].roundNumber(x);
}

const f32 = new Float32Array(1);
const u32 = new Uint32Array(f32.buffer);

/** The next number of the target arithmetic above x (x finite and of that arithmetic). */
export function nextUpIn(x: number, arithmetic: Arithmetic): number {
  if (arithmetic === 'float64') return nextUp(x);
  if (x === 0) return ARITHMETICS.float32.minSubnormal;
  f32[0] = x;
  u32[0] = x > 0 ? u32[0]! + 1 : u32[0]! - 1;
  return f32[0]!;
}

/** The next number of the target arithmetic below x (x finite and of that arithmetic). */
export function nextDownIn(x: number, arithmetic: Arithmetic): number {
  return arithmetic === 'float64' ? nextDown(x) : -nextUpIn(-x, arithmetic);
}
