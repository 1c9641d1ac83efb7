/**
 * `verify --report FILE.html`: one self-contained page (inline CSS and SVG,
 * no scripts, no fonts or images fetched) showing the measured error of the
 * in-process check, which runs the very IEEE operations the emitted C and
 * TypeScript run. One input: the error against the input; several inputs:
 * one small plot per input of the worst error projected onto it. Every spec
 * text on the page is HTML-escaped. Same data, same bytes: no time stamps.
 */
import Handlebars from 'handlebars';
import { formatEUp } from '../../emit/literals/round-up.js';
import { formatE, formatG } from '../printf.js';
import type { CheckSummary, SummaryLanguage } from '../summary.js';
import { errorEnvelope, type ReportPoint } from './envelope.js';
import { MIN_EDGE_SPACING_PX, svgPlot } from './svg-plot.js';

export interface ReportData {
  readonly functionName: string;
  readonly spec: string;
  readonly arithmetic: string;
  readonly kind: 'absolute' | 'relative';
  readonly bound: number;
  readonly target: number;
  readonly inputs: readonly { readonly name: string; readonly lo: number; readonly hi: number }[];
  /** Segment edges per input (empty lists without tables). */
  readonly edges: readonly (readonly number[])[];
  readonly points: readonly ReportPoint[];
  /** The checks, with the language their summary line names when read back from a harness. */
  readonly checks: readonly (CheckSummary & { readonly language?: SummaryLanguage })[];
}

const esc = (s: string): string => Handlebars.Utils.escapeExpression(s);
/** Every number as the summary lines print it (C's %.1e; input values %.9g). */
const sci = (x: number): string => formatE(x, 1);

/** The label a check's summary line gives it (`check NAME (LANGUAGE, ...)`). */
const LABELS: Readonly<Record<CheckSummary['target'], string>> = { 'in-process': 'in-process', c: 'C', ts: 'TypeScript', glsl: 'GLSL', wgsl: 'WGSL', rust: 'Rust' };

export function reportHtml(d: ReportData): string {
  const one = d.inputs.length === 1;
  const yLabel = `${d.kind} error`;
  const plots = d.inputs.map((inp, j) =>
    svgPlot({
      width: one ? 760 : 380,
      height: one ? 380 : 250,
      inputName: inp.name,
      lo: inp.lo,
      hi: inp.hi,
      yLabel: one ? yLabel : `worst ${yLabel}`,
      bins: errorEnvelope(d.points, j, inp.lo, inp.hi, one ? 400 : 80),
      bound: d.bound,
      target: d.target,
      edges: d.edges[j] ?? [],
    }),
  );
  const caption = one
    ? `Measured ${yLabel} against ${esc(d.inputs[0]!.name)} (largest error in each of 400 equal bins), log scale.`
    : `Worst measured ${yLabel} over the other inputs, projected onto each input (80 bins each), log scale.`;
  const edgeCount = d.edges.reduce((n, e) => n + e.length, 0);
  const plotWidth = (one ? 760 : 380) - 80;
  const dense = d.edges.some((e) => e.length > 0 && plotWidth / (e.length + 1) < MIN_EDGE_SPACING_PX);
  const edgeNote =
    edgeCount === 0
      ? ''
      : dense
        ? ` Grey ticks under the plot: the ${edgeCount} segment edges, where the function switches to the next table entry (too close together for full lines).`
        : ' Grey dashed vertical lines: the segment edges, where the function switches to the next table entry.';
  // One rounding: every row shows the certified bound rounded up once, as the summary lines do.
  const bound = formatEUp(d.bound, 1);
  const rows = d.checks.map(
    (c) =>
      `<tr><td>${esc(c.language ?? LABELS[c.target])}</td><td>${c.points}</td><td>${c.worstAt.length > 0 ? sci(c.worstError) : 'none'}</td><td>${esc(
        c.worstAt.map((v, j) => `${c.inputNames[j] ?? `input ${j}`} = ${formatG(v, 9)}`).join(', '),
      )}</td><td>${bound}</td><td>${sci(c.targetAccuracy)}</td><td class="${c.pass ? 'pass' : 'fail'}">${c.pass ? 'PASS' : 'FAIL'}</td></tr>`,
  );
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<title>rootcast error report: ${esc(d.functionName)}</title>
<style>
body { font-family: sans-serif; margin: 24px; color: #222; }
h1 { font-size: 20px; margin: 0 0 4px; }
p.meta { margin: 0 0 16px; color: #555; }
div.plots { display: flex; flex-wrap: wrap; gap: 12px; }
table { border-collapse: collapse; margin-top: 16px; font-size: 13px; }
td, th { border: 1px solid #ccc; padding: 3px 8px; text-align: left; }
td.pass { color: #208040; font-weight: bold; }
td.fail { color: #c03020; font-weight: bold; }
</style>
</head>
<body>
<h1>${esc(d.functionName)}: measured error</h1>
<p class="meta">spec ${esc(d.spec)}; ${esc(d.arithmetic)}; ${d.points.length} points; certified bound ${bound} (rounded up); target ${sci(d.target)} (${d.kind})</p>
<p>${caption} Red dashed line: the certified bound. Green dotted line: the target.${edgeNote}</p>
<div class="plots">
${plots.join('\n')}
</div>
<table class="checks">
<tr><th>check</th><th>points</th><th>worst error</th><th>at</th><th>certified bound</th><th>target</th><th>verdict</th></tr>
${rows.join('\n')}
</table>
</body>
</html>
`;
}
