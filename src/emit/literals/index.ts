/** The literal formatters, one per target, and the rounded-up bound printer. */
export { cLiteral, cOperand } from './c.js';
export { tsLiteral, tsOperand } from './ts.js';
export { formatBoundUp, roundUpDigits } from './round-up.js';
export { shortestFloat32Digits } from './shortest-float32.js';
