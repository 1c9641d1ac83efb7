/**
 * Where the examples live. Tests hand the planner the relative spec path
 * `examples/<file>`, as `npm run samples` does (so what the headers say about
 * the spec is the same as in generated-samples/); that path is read relative
 * to the repository root, so the root is made the working directory here.
 */
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const REPO_ROOT = fileURLToPath(new URL('../../..', import.meta.url)).replace(/\/$/, '');

/** Makes the repository root the working directory (jest usually starts there already). */
export function atRepoRoot(): void {
  if (process.cwd() !== REPO_ROOT) process.chdir(REPO_ROOT);
}

/** Every examples/*.yaml file name, sorted (the order `npm run samples` uses). */
export function exampleFiles(): string[] {
  return readdirSync(`${REPO_ROOT}/examples`)
    .filter((f) => f.endsWith('.yaml'))
    .sort();
}

/**
 * The fixed32 examples, as `fixed32/<file>` (they live in examples/fixed32/,
 * so the tests of float examples, which read examples/*.yaml, do not see them;
 * their samples are generated-samples/<name>/ like every other example).
 */
export function fixedExampleFiles(): string[] {
  return readdirSync(`${REPO_ROOT}/examples/fixed32`)
    .filter((f) => f.endsWith('.yaml'))
    .sort()
    .map((f) => `fixed32/${f}`);
}

/** The relative spec path the emitted headers carry. */
export function specPathOf(file: string): string {
  return `examples/${file}`;
}

/** The generated-samples folder name of an example: its file name without `.yaml` (and without `fixed32/`). */
export function sampleFolderOf(file: string): string {
  return file.replace(/^fixed32\//, '').replace(/\.yaml$/, '');
}
