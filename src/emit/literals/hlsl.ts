/** HLSL literals: the shared shader literal (shader.ts), `1.5f`, a `float` in HLSL. */
export { shaderLiteral as hlslLiteral, shaderOperand as hlslOperand } from './shader.js';
