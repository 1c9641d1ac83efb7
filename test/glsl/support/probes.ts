/**
 * Probes into an emitted GLSL snippet: copies of NAME.glsl, exactly as
 * emitted, whose two functions (float and vec4) return an intermediate value
 * instead of the root, so a shader can show what the GPU computed for it:
 *   - 'part':  one part's clamped segment number `rc_s<node>_<k>`, the
 *              printer's `clamp(int(roundEven(t)), 0, count - 1)`;
 *   - 'index': the combined segment number `v<node>` the tables are read at;
 *   - 'coarse': for a part with a two-level index (TWO-LEVEL INDEX in
 *              src/ir/nodes.ts), the coarse cell its coarse-cell table is
 *              read at, `rc_s<node>_<k>g >> level` (the printer's clamped
 *              fine-grid position, shifted as the printed read shifts it);
 *   - 'table': the value a table read returns, with the table's entries
 *              replaced by their own positions 0, 1, ..., n - 1, so the value
 *              read is the position read.
 * Only the `return` line (and, for 'table', the entries) change; every line
 * that computes the segment number is the printer's own. A WebGL
 * implementation may clamp an out-of-range index of its own accord (ANGLE
 * does for WebGL), so a 'table' probe alone could not show an out-of-range
 * read: the 'part' and 'index' probes read the numbers before any read.
 */
import { partRows, type IndexPart, type Program } from '../../../src/ir/nodes.js';
import { valueName } from '../../../src/emit/names.js';

export interface Probe {
  readonly label: string;
  readonly kind: 'part' | 'coarse' | 'index' | 'table';
  /** The IR node probed (the index node for 'part' and 'index', the table node for 'table'). */
  readonly node: number;
  /** 'part' and 'coarse' only: which part, and the part itself. */
  readonly part?: number;
  readonly indexPart?: IndexPart;
  /** 'table' only: the index node the table is read at. */
  readonly readsAt?: number;
  /** How many values the probed number can take: [0, count - 1]. */
  readonly count: number;
  /** The probe's function name (both overloads). */
  readonly fn: string;
  /** The probe's snippet text. */
  readonly snippet: string;
}

/** Every part, index and table probe of a program's snippet. */
export function snippetProbes(snippet: string, name: string, program: Program): Probe[] {
  const probes: Omit<Probe, 'fn' | 'snippet'>[] = [];
  program.nodes.forEach((n, i) => {
    if (n.kind === 'index') {
      n.parts.forEach((p, k) => {
        probes.push({ label: `segment part ${k} (node ${i})`, kind: 'part', node: i, part: k, indexPart: p, count: partRows(p) });
        if (p.fine) probes.push({ label: `coarse cell of part ${k} (node ${i})`, kind: 'coarse', node: i, part: k, indexPart: p, count: p.fine.meta.length });
      });
      const total = n.parts.reduce((s, p) => s + (partRows(p) - 1) * p.stride, 0) + 1;
      probes.push({ label: `segment number (node ${i})`, kind: 'index', node: i, count: total });
    }
    if (n.kind === 'table') probes.push({ label: `table read (node ${i})`, kind: 'table', node: i, readsAt: n.index, count: n.values.length });
  });
  return probes.map((p, i) => {
    const fn = `${name}_rc_probe${i}`;
    return { ...p, fn, snippet: probeSnippet(snippet, name, fn, p) };
  });
}

function probeSnippet(snippet: string, name: string, fn: string, p: Omit<Probe, 'fn' | 'snippet'>): string {
  const guard = `ROOTCAST_GLSL_${name.toUpperCase()}`;
  if (!snippet.includes(`#ifndef ${guard}\n#define ${guard}\n`)) throw new Error(`no include guard ${guard} in the snippet`);
  let text = snippet.split(guard).join(`${guard}_RC_PROBE_${fn.toUpperCase()}`);
  // The global tables get the probe's own names, so several probes can share one shader.
  text = text.split(`rc_${name}_`).join(`rc_${fn}_`);
  const split = text.indexOf(`\nvec4 ${name}(`);
  if (split < 0 || !text.includes(`\nfloat ${name}(`)) throw new Error(`no float and vec4 ${name} in the snippet`);
  let scalar = text.slice(0, split).replace(`\nfloat ${name}(`, `\nfloat ${fn}(`);
  let vector = text.slice(split).replace(`\nvec4 ${name}(`, `\nvec4 ${fn}(`);
  // The printer's names: `rc_s<node>_<part>` for a part, `v<node>` for the index and a table read.
  const value = p.kind === 'part' ? `rc_s${p.node}_${p.part!}` : p.kind === 'coarse' ? `rc_s${p.node}_${p.part!}g` : valueName(p.node);
  const read = p.kind === 'coarse' ? `${value} >> ${p.indexPart!.fine!.level}` : value;
  const declared = new RegExp(`\\b(int|ivec4|float|vec4) ${value} = `);
  for (const body of [scalar, vector]) if (!declared.test(body)) throw new Error(`the snippet computes no ${value} (the printer's names changed?)`);
  if (p.kind === 'table') {
    // The tables are global, written once before both overloads (src/emit/glsl/body.ts).
    const table = new RegExp(`(const float rc_${fn}_tab${p.node}\\[${p.count}\\] = float\\[${p.count}\\]\\()[^)]*(\\);)`, 'g');
    const positions = Array.from({ length: p.count }, (_, k) => `${k}.0`).join(', ');
    const before = scalar;
    scalar = scalar.replace(table, `$1${positions}$2`);
    if (scalar === before) throw new Error(`no table rc_${fn}_tab${p.node}[${p.count}] in the snippet`);
  }
  const ret = /^( +)return [^\n]*;$/m;
  if (!ret.test(scalar) || !ret.test(vector)) throw new Error('no return line in a function of the snippet');
  scalar = scalar.replace(ret, `$1return float(${read});`);
  vector = vector.replace(ret, `$1return vec4(${read});`);
  text = scalar + vector;
  return text;
}
