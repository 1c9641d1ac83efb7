/**
 * The emitted files of a fixed32 program for a set of targets, in the order
 * and with the names of outputs.ts (the fixed-point counterpart of files.ts).
 * Which targets have a fixed32 form is the arithmetic table's to say
 * (src/family/arithmetic.ts): a target without one, asked for alone, is
 * refused in one located line; within `all` it is left out. Every file's stamp
 * (stamp.ts) records its role and is sealed with the file's content hash, so
 * `emit --check` treats fixed32 files as it treats float ones.
 */
import { cFixedFunction } from './c/fixed-function.js';
import type { FixedEmitInput } from './fixed-types.js';
import { cFixedHarness } from './harness/fixed-c.js';
import { tsFixedHarness } from './harness/fixed-ts.js';
import { refuseTargetForFixed } from './fixed-refuse.js';
import { applicableTargetsFor, type TargetName } from './outputs.js';
import { sealStamp } from './stamp.js';
import { tsFixedFunction } from './ts/fixed-function.js';
import { rustFixedFunction } from './rust/fixed-function.js';
import type { EmittedFile } from './types.js';

type FixedPrinter = (input: FixedEmitInput) => EmittedFile;

/** Per target with a fixed32 form: the function printer and the harness writer (null: checked by a bit runner in src/verify). */
const FIXED_PRINTERS: Readonly<Partial<Record<TargetName, { readonly function: FixedPrinter; readonly harness: FixedPrinter | null }>>> = {
  c: { function: cFixedFunction, harness: cFixedHarness },
  ts: { function: tsFixedFunction, harness: tsFixedHarness },
  // Checked through the bit runner in src/verify/rust/fixed-run.ts: no harness file.
  rust: { function: rustFixedFunction, harness: null },
};

/** The files for the targets; `harness: false` leaves the harnesses out. */
export function fixedEmitFiles(input: FixedEmitInput, targets: readonly TargetName[], options: { readonly harness: boolean } = { harness: true }): EmittedFile[] {
  if (targets.length === 1) refuseTargetForFixed(input.family, targets[0]!);
  const out: EmittedFile[] = [];
  for (const t of applicableTargetsFor('fixed32', targets)) {
    const printers = FIXED_PRINTERS[t];
    if (!printers) throw new Error(`the arithmetic table allows ${t} for fixed32 but no fixed32 printer is listed for it`);
    out.push(printers.function({ ...input, role: { target: t, kind: 'function' } }));
    if (options.harness && printers.harness) out.push(printers.harness({ ...input, role: { target: t, kind: 'harness' } }));
  }
  return out.map((f) => ({ path: f.path, text: sealStamp(f.text) }));
}
