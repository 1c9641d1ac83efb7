/** WGSL literals: the shared shader literal (shader.ts), `1.5f`, an f32 in WGSL. */
export { shaderLiteral as wgslLiteral, shaderOperand as wgslOperand } from './shader.js';
