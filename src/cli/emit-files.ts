/** The emitted files per target live in src/emit/files.ts (their names in src/emit/outputs.ts); re-exported for scripts and tests. */
export { applicableTargets, emitFiles } from '../emit/files.js';
export { TARGETS, targetAllows, targetsOf, type TargetName } from '../emit/outputs.js';
