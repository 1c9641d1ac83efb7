/** The emitted files for a set of targets, in a fixed order (file names: outputs.ts). */
import { cFunction } from './c/function.js';
import { glslFunction } from './glsl/function.js';
import { cHarness } from './harness/c.js';
import { glslHarness } from './harness/glsl.js';
import { tsHarness } from './harness/ts.js';
import { sealStamp } from './stamp.js';
import { tsFunction } from './ts/function.js';
import { hlslFunction } from './hlsl/function.js';
import { rustFunction } from './rust/function.js';
import { wgslFunction } from './wgsl/function.js';
import type { EmitInput, EmittedFile } from './types.js';
import { applicableTargetsFor, type TargetName } from './outputs.js';

export { TARGETS, targetAllows, targetsOf, type TargetName } from './outputs.js';

type Printer = (input: EmitInput) => EmittedFile;

/** Per target: the function printer and the harness writer. A new target adds a row here and in outputs.ts. */
const PRINTERS: Readonly<Record<TargetName, { readonly function: Printer; readonly harness: Printer | null }>> = {
  c: { function: cFunction, harness: cHarness },
  ts: { function: tsFunction, harness: tsHarness },
  glsl: { function: glslFunction, harness: glslHarness },
  // Checked through bit runners in src/verify: no harness file.
  wgsl: { function: wgslFunction, harness: null },
  hlsl: { function: hlslFunction, harness: null },
  rust: { function: rustFunction, harness: null },
};

/**
 * Every file for the targets, in a fixed order: function then harness, C, then
 * TypeScript, then GLSL. GLSL has no float64: asked for alone it refuses a
 * float64 spec (one line, exit 2); asked for with other targets (`all`) it is
 * left out for float64, so `all` means every target the arithmetic allows.
 * Each file's stamp (src/emit/stamp.ts) records its role and is sealed with
 * the file's content hash. `harness: false` leaves the harnesses out.
 */
export function emitFiles(input: EmitInput, targets: readonly TargetName[], options: { readonly harness: boolean } = { harness: true }): EmittedFile[] {
  const out: EmittedFile[] = [];
  for (const t of applicableTargets(input, targets)) {
    out.push(PRINTERS[t].function({ ...input, role: { target: t, kind: 'function' } }));
    const harness = PRINTERS[t].harness;
    if (options.harness && harness) out.push(harness({ ...input, role: { target: t, kind: 'harness' } }));
  }
  return out.map((f) => ({ path: f.path, text: sealStamp(f.text) }));
}

/** The requested targets in TARGETS order, without glsl for a float64 program when others were requested too. */
export function applicableTargets(input: EmitInput, targets: readonly TargetName[]): TargetName[] {
  return applicableTargetsFor(input.program.arithmetic, targets);
}
