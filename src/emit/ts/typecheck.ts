/**
 * Type-checks and transpiles emitted TypeScript in memory, with the compiler
 * ts-morph bundles (its `ts`), so checking never depends on what is installed
 * in the user's project and never writes a file.
 *
 * The check is strict mode, ES2022 with only the ES2022 library (no DOM, no
 * Node types: emitted code must not need them), and node's own ES module
 * rules (NodeNext, every file an ES module), so a relative import without its
 * `.js` extension fails here as it would fail in node.
 */
import { Project, ts, type Diagnostic } from 'ts-morph';

export interface SourceText {
  readonly path: string;
  readonly text: string;
}

export interface TypeCheckOptions {
  /** Also report unused locals and parameters (noUnusedLocals, noUnusedParameters). */
  readonly noUnused?: boolean;
}

const ROOT = '/rootcast-emitted';

/** Diagnostics as `path:line:column: TSnnnn: message`, one string each; empty when the files check clean. */
export function typeCheckTs(files: readonly SourceText[], options: TypeCheckOptions = {}): string[] {
  const project = checkingProject(options.noUnused === true);
  const sources = files.map((f) => {
    const source = project.createSourceFile(`${ROOT}/${relative(f.path)}`, f.text);
    // Emitted files are ES modules by contract. Under NodeNext the compiler
    // learns a .ts file's format from the nearest package.json, through the
    // options it passes when it asks its host for the file; ts-morph's host
    // drops those options, so we state the format here, as a host must.
    source.compilerNode.impliedNodeFormat = ts.ModuleKind.ESNext;
    return source;
  });
  try {
    return project.getPreEmitDiagnostics().map((d) => {
      const message = ts.flattenDiagnosticMessageText(d.getMessageText() as string | ts.DiagnosticMessageChain, '\n');
      const file = d.getSourceFile();
      const where = file ? `${file.getFilePath().replace(`${ROOT}/`, '')}:${d.getLineNumber() ?? 0}:${column(d)}` : '(options)';
      return `${where}: TS${d.getCode()}: ${message}`;
    });
  } finally {
    for (const source of sources) project.removeSourceFile(source);
  }
}

/**
 * One project per option set, kept for the process: the library files are
 * parsed once (the first check costs about a second, later ones a quarter of
 * that). Each check adds its files and removes them again, so checks never
 * see each other's files.
 */
const projects = new Map<boolean, Project>();

function checkingProject(noUnused: boolean): Project {
  const hit = projects.get(noUnused);
  if (hit) return hit;
  const project = new Project({
    useInMemoryFileSystem: true,
    compilerOptions: {
      strict: true,
      noEmit: true,
      target: ts.ScriptTarget.ES2022,
      module: ts.ModuleKind.NodeNext,
      moduleResolution: ts.ModuleResolutionKind.NodeNext,
      lib: ['lib.es2022.d.ts'],
      types: [],
      noUnusedLocals: noUnused,
      noUnusedParameters: noUnused,
    },
  });
  projects.set(noUnused, project);
  return project;
}

/**
 * ES module JavaScript for node 20, one output per input (`x.ts` -> `x.js`).
 * Relative imports already carry `.js`, so they resolve unchanged. Run the
 * output where a package.json says "type": "module" (or rename to .mjs).
 */
export function transpileTs(files: readonly SourceText[]): SourceText[] {
  return files.map((f) => {
    const out = ts.transpileModule(f.text, {
      fileName: relative(f.path),
      compilerOptions: { module: ts.ModuleKind.ES2022, target: ts.ScriptTarget.ES2022, removeComments: false },
      reportDiagnostics: true,
    });
    const errors = out.diagnostics ?? [];
    if (errors.length > 0) {
      const text = errors.map((d) => ts.flattenDiagnosticMessageText(d.messageText, '\n')).join('; ');
      throw new Error(`${f.path}: cannot transpile: ${text}`);
    }
    return { path: f.path.replace(/\.ts$/, '.js'), text: out.outputText };
  });
}

function relative(path: string): string {
  if (path.startsWith('/') || path.split('/').includes('..')) throw new RangeError(`emitted paths are relative to the output directory: ${path}`);
  return path;
}

function column(d: Diagnostic): number {
  const start = d.getStart();
  const file = d.getSourceFile();
  return start === undefined || !file ? 0 : file.getLineAndColumnAtPos(start).column;
}
