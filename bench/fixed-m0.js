// npm run bench (part): the fixed32 Pt1000 function against the same spec's
// float32 function, both built with arm-none-eabi-gcc -O2 -mcpu=cortex-m0
// (the float32 one through the compiler's soft-float routines, __aeabi_f*),
// run on QEMU's emulated Cortex-M0 (the microbit machine). Instructions
// executed per call are counted from QEMU's execution log with one guest
// instruction per translation block (-singlestep -d exec,nochain): every
// instruction from the call until control is back in the caller, library
// routines included. Min and max over the sample points.
import { readFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { spawnSync } from 'node:child_process';
import { readSpec } from '../dist/reader/read.js';
import { makeFixedPlan } from '../dist/plan/fixed/plan-fixed.js';
import { fixedEmitInputOf, fixedFiles } from '../dist/cli/fixed/pipeline.js';
import { emitInputOf } from '../dist/cli/pipeline.js';
import { emitFiles } from '../dist/cli/emit-files.js';
import { makePlan } from '../dist/plan/plan.js';
import { fixedSamplePoints } from '../dist/verify/fixed-samples.js';
import { qemuMissing, runOnCore } from '../dist/verify/qemu.js';
import { cortexM0Cost } from '../dist/ir/cost/cortex-m0.js';

const SPEC = 'examples/fixed32/pt1000-celsius.yaml';
const missing = qemuMissing();
if (missing) {
  console.log(`fixed32 vs soft-float on Cortex-M0: skipped (${missing})`);
  process.exit(0);
}
const text = readFileSync(SPEC, 'utf8');
const fixedFamily = readSpec(SPEC, text);
const fixedPlan = makeFixedPlan(fixedFamily);
const fixedHeader = fixedFiles(fixedEmitInputOf(fixedPlan), ['c'])[0];
// The same spec in float32: the fixed section dropped.
const floatText = text.replace(/^arithmetic: fixed32[\s\S]*$/m, 'arithmetic: float32\n');
const floatPlan = makePlan(readSpec(SPEC, floatText));
const floatHeader = emitFiles(emitInputOf(floatPlan), ['c'])[0];

const raws = fixedSamplePoints(fixedPlan.program, fixedPlan.rawLo, fixedPlan.rawHi, 200, 1);
const fixedRun = runOnCore({ header: fixedHeader, name: 'pt1000_celsius', argType: 'int32_t', resultType: 'int32_t', inputs: raws.map(String) }, 'cortex-m0', true);
// The float32 function gets the same inputs as float32 ohms (raw / 2^16 rounded to binary32).
const floatInputs = raws.map((r) => `(float)${Math.fround(Number(r) / 65536).toPrecision(9)}`);
const floatRun = runOnCore({ header: floatHeader, name: 'pt1000_celsius', argType: 'float', resultType: 'float', inputs: floatInputs }, 'cortex-m0', true);
const range = (xs) => `${Math.min(...xs)} .. ${Math.max(...xs)}`;
const gcc = spawnSync('arm-none-eabi-gcc', ['--version'], { encoding: 'utf8' }).stdout.split('\n')[0];
const qemu = spawnSync('qemu-system-arm', ['--version'], { encoding: 'utf8' }).stdout.split('\n')[0];
console.log(`fixed32 vs soft-float float32 on an emulated Cortex-M0 (${SPEC}, ${raws.length} sample points)`);
console.log(`  machine: ${cpus()[0]?.model ?? 'unknown'}; ${gcc}; ${qemu} -M microbit`);
console.log(`  fixed32  (${fixedPlan.segments} segments, degree ${fixedPlan.degree}, bound ${fixedPlan.bound.total.toExponential(1)} degC): instructions per call ${range(fixedRun.perCall)} (header model ${cortexM0Cost(fixedPlan.program).instructions})`);
console.log(`  float32  (soft-float, ${floatPlan.form}, bound ${floatPlan.bound.total.toExponential(1)} degC):          instructions per call ${range(floatRun.perCall)}`);
console.log(`  ratio (float32 max / fixed32 max): ${(Math.max(...floatRun.perCall) / Math.max(...fixedRun.perCall)).toFixed(1)}`);
