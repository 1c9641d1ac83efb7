/**
 * One float64's two 32-bit words, read and written without allocating: a
 * shared scratch buffer for the functions that take a double apart
 * (next-float.ts nextUpByWords, rational.ts fromNumber, gcd.ts bitLength,
 * ir/builder.ts tableHash).
 * Each writes FLOAT64[0] and reads WORDS at once, calling nothing in
 * between, so one buffer serves them all.
 */
export const FLOAT64 = new Float64Array(1);
export const WORDS = new Uint32Array(FLOAT64.buffer);
const LITTLE = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;
/** Index in WORDS of the low 32 bits of the significand. */
export const LO = LITTLE ? 0 : 1;
/** Index in WORDS of the sign, exponent and top 20 bits of the significand. */
export const HI = LITTLE ? 1 : 0;
