/**
 * One error plot as inline SVG: the measured error (log scale) against one
 * input, with the certified bound and the target as horizontal lines, input
 * segment edges as vertical lines when the plan has segments, and labelled
 * axes. Every element carries a class naming what it shows, so a test (or a
 * reader of the source) can find the data path, the bound and the target.
 */
import Handlebars from 'handlebars';
import { formatEUp } from '../../emit/literals/round-up.js';
import { formatE, formatG } from '../printf.js';
import type { EnvelopeBin } from './envelope.js';

export interface PlotSpec {
  readonly width: number;
  readonly height: number;
  readonly inputName: string;
  readonly lo: number;
  readonly hi: number;
  readonly yLabel: string;
  readonly bins: readonly EnvelopeBin[];
  readonly bound: number;
  readonly target: number;
  /** Input values where segments meet (none for a plan without tables). */
  readonly edges: readonly number[];
}

const esc = (s: string): string => Handlebars.Utils.escapeExpression(s);
/** Axis values in C's %.4g, the target in %.1e: the formats of the summary lines (printf.ts). */
const num = (x: number): string => formatG(x, 4);
/** Closer than this (px), full-height edge lines would merge into a striped block: they become ticks under the plot. */
export const MIN_EDGE_SPACING_PX = 6;
const px = (x: number): string => x.toFixed(1);

export function svgPlot(p: PlotSpec): string {
  const m = { left: 64, right: 16, top: 14, bottom: 46 };
  const w = p.width - m.left - m.right;
  const h = p.height - m.top - m.bottom;
  const finite = p.bins.map((b) => b.error).filter((e) => Number.isFinite(e));
  const positive = finite.filter((e) => e > 0);
  // Decades shown: from below the smallest non-zero error to above the target,
  // at most 12 decades so the lines of interest keep their room.
  const top = Math.ceil(Math.log10(Math.max(p.target, p.bound, ...finite, Number.MIN_VALUE)) + 0.3);
  const lowest = positive.length > 0 ? Math.floor(Math.log10(Math.min(...positive))) : top - 6;
  const bottom = Math.max(lowest, top - 12);
  const sx = (x: number): number => m.left + (p.hi > p.lo ? ((x - p.lo) / (p.hi - p.lo)) * w : w / 2);
  const sy = (e: number): number => {
    const d = e > 0 && Number.isFinite(e) ? Math.log10(e) : e > 0 ? top : bottom;
    return m.top + h - ((Math.min(top, Math.max(bottom, d)) - bottom) / (top - bottom)) * h;
  };
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${p.width}" height="${p.height}" viewBox="0 0 ${p.width} ${p.height}" class="error-plot" data-input="${esc(p.inputName)}">`);
  parts.push(`<rect class="frame" x="${m.left}" y="${m.top}" width="${w}" height="${h}" fill="#fff" stroke="#888"/>`);
  const step = Math.max(1, Math.ceil((top - bottom) / 6));
  for (let d = bottom; d <= top; d += step) {
    const y = px(sy(10 ** d));
    parts.push(`<line class="grid" x1="${m.left}" x2="${m.left + w}" y1="${y}" y2="${y}" stroke="#eee"/>`);
    parts.push(`<text class="tick y-tick" x="${m.left - 6}" y="${y}" text-anchor="end" dominant-baseline="middle" font-size="11">1e${d}</text>`);
  }
  for (let k = 0; k <= 4; k++) {
    const x = p.lo + ((p.hi - p.lo) * k) / 4;
    parts.push(`<text class="tick x-tick" x="${px(sx(x))}" y="${m.top + h + 16}" text-anchor="middle" font-size="11">${num(x)}</text>`);
  }
  if (p.edges.length > 0 && w / (p.edges.length + 1) >= MIN_EDGE_SPACING_PX) {
    for (const e of p.edges) {
      parts.push(`<line class="segment-edge" x1="${px(sx(e))}" x2="${px(sx(e))}" y1="${m.top}" y2="${m.top + h}" stroke="#999" stroke-dasharray="2 3"/>`);
    }
  } else if (p.edges.length > 0) {
    // Hundreds of edges: one short tick each just under the frame (a rug), so the data stays readable.
    const ticks = p.edges.map((e) => `M${px(sx(e))} ${m.top + h}v5`).join('');
    parts.push(`<path class="segment-edge-ticks" d="${ticks}" stroke="#999" stroke-width="0.5" fill="none"/>`);
  }
  const path = p.bins.map((b, i) => `${i === 0 ? 'M' : 'L'}${px(sx(b.x))} ${px(sy(b.error))}`).join(' ');
  parts.push(`<path class="data" d="${path}" fill="none" stroke="#1f5fbf" stroke-width="1.5"/>`);
  const worst = p.bins.reduce<EnvelopeBin | null>((a, b) => (a === null || b.error > a.error ? b : a), null);
  if (worst) parts.push(`<circle class="worst" cx="${px(sx(worst.x))}" cy="${px(sy(worst.error))}" r="3.5" fill="#1f5fbf"/>`);
  // The bound prints rounded up, as everywhere; the target as given.
  // The bound's label sits under its line at the right, the target's above its line at the left, so close lines keep readable labels.
  const hline = (cls: string, value: number, colour: string, dash: string, label: string, below: boolean): void => {
    const y = px(sy(value));
    parts.push(`<line class="${cls}" x1="${m.left}" x2="${m.left + w}" y1="${y}" y2="${y}" stroke="${colour}" stroke-width="1.5" stroke-dasharray="${dash}"/>`);
    parts.push(`<text class="${cls}-label" x="${below ? m.left + w - 4 : m.left + 4}" y="${px(sy(value) + (below ? 13 : -4))}" text-anchor="${below ? 'end' : 'start'}" font-size="11" fill="${colour}">${esc(label)} ${below ? formatEUp(value, 1) : formatE(value, 1)}</text>`);
  };
  hline('bound', p.bound, '#c03020', '6 3', 'certified bound', true);
  hline('target', p.target, '#208040', '2 2', 'target', false);
  parts.push(`<text class="axis-label x-label" x="${m.left + w / 2}" y="${p.height - 8}" text-anchor="middle" font-size="12">${esc(p.inputName)}</text>`);
  parts.push(`<text class="axis-label y-label" transform="translate(14 ${m.top + h / 2}) rotate(-90)" text-anchor="middle" font-size="12">${esc(p.yLabel)}</text>`);
  parts.push('</svg>');
  return parts.join('\n');
}
