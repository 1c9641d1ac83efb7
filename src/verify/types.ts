/**
 * Verification's data: what its main function (run.ts `verify`) takes and
 * returns, the same for float and fixed32 programs.
 */
import type { EmitInput } from '../emit/types.js';
import type { FixedEmitInput } from '../emit/fixed-types.js';
import type { TargetName } from '../emit/outputs.js';
import type { BitCheckJson, BranchCheckJson } from './json.js';
import type { ReportData } from './report/html.js';
import type { CheckSummary } from './summary.js';

/** The program to verify, as the emitter takes it. */
export type VerifyInput = { readonly kind: 'float'; readonly emit: EmitInput } | { readonly kind: 'fixed32'; readonly emit: FixedEmitInput };

export interface VerifyOptions {
  readonly targets: readonly TargetName[];
  /** True for `--target all`: a missing Chromium skips GLSL instead of refusing. */
  readonly all: boolean;
  readonly samples: number;
  readonly seed: number;
  /** Keep every in-process point's error (for the report). */
  readonly keepPoints?: boolean;
  /** Called with (points done, total) during the in-process check. */
  readonly onProgress?: (done: number, total: number) => void;
}

/**
 * What verification returns, for a float program (verifyProgram) and a
 * fixed32 one (fixed-run.ts verifyFixedProgram) alike: plain data. The CLI
 * prints `lines` (or the `--json` object of the checks, verifyJson), writes
 * `report` with reportHtml when asked, and sets the exit code from `pass`.
 */
export interface VerifyResult {
  /** Every line to show, in order: summary lines, harness failures, bit and branch lines, skips. */
  readonly lines: readonly string[];
  /** The in-process check, then each harness's, read back from its summary lines. */
  readonly checks: readonly CheckSummary[];
  /** Bit comparisons with the in-process results (the emulated cores; fixed32 harnesses and Rust). */
  readonly bitChecks: readonly BitCheckJson[];
  /** Null when no C was checked or no toolchain was found. */
  readonly branches: BranchCheckJson | null;
  /** Harness failures (a harness that did not run to its summary), one line each; also in `lines`. */
  readonly harnessFailures: readonly string[];
  /** Checks that could not run here (a missing tool), one line each; also in `lines`. */
  readonly skipped: readonly string[];
  /** What the HTML report draws (its points only with `keepPoints`). */
  readonly report: ReportData;
  readonly inProcess: CheckSummary;
  readonly pass: boolean;
}

