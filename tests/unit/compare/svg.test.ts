// The SVG export: axes with ticks (linear and log), one styled path per curve, a legend citing DOIs; text escaped.
import { describe, expect, it } from 'vitest';
import { drawPlan, MAX_RUNS } from '@/lib/compare/draw-plan';
import { curveStyle } from '@/lib/compare/palette';
import { prepareOverlay } from '@/lib/compare/prepare-overlay';
import { renderOverlaySvg } from '@/lib/compare/render-svg';
import { linearScale, logScale } from '@/lib/compare/ticks';
import { copperFilm, itoFilm, localFile, rhoOfT } from './fixtures';

describe('ticks', () => {
  it('linear: steps of 1, 2 or 5 × 10ⁿ, range widened to whole steps', () => {
    const s = linearScale(2, 300);
    expect([s.lo, s.hi]).toEqual([0, 300]);
    expect(s.ticks.map((t) => t.value)).toEqual([0, 50, 100, 150, 200, 250, 300]);
    expect(linearScale(0.55, 1.75).ticks.map((t) => t.label)).toEqual(['0.4', '0.6', '0.8', '1', '1.2', '1.4', '1.6', '1.8']);
  });
  it('log: whole decades, decade labels typeset as 10ⁿ, 2 and 5 labelled on short axes', () => {
    const s = logScale(5.5e-9, 4.1e-6);
    expect([s.lo, s.hi]).toEqual([1e-9, 1e-5]);
    expect(s.ticks.filter((t) => t.label).map((t) => t.label)).toEqual(['10⁻⁹', '10⁻⁸', '10⁻⁷', '10⁻⁶', '10⁻⁵']);
    expect(s.ticks).toHaveLength(4 * 9 + 1); // 1–9 in each of 4 decades, plus the top decade
    expect(logScale(2, 90).ticks.filter((t) => t.label).map((t) => t.label)).toEqual(['1', '2', '5', '10', '20', '50', '100']);
    expect(logScale(2, 300).ticks.filter((t) => t.label).map((t) => t.label)).toEqual(['1', '10', '100', '1000']);
  });
});

describe('drawPlan', () => {
  it('one line for a monotonic sweep; runs that share the turning point for a sweep that comes back', () => {
    expect(drawPlan([1, 2, 3], [5, 6, 7])).toEqual({ kind: 'lines', runs: [{ x: [1, 2, 3], y: [5, 6, 7] }] });
    expect(drawPlan([0, 1, 2, 1, 0], [1, 2, 3, 2.5, 1.5])).toEqual({
      kind: 'lines', runs: [{ x: [0, 1, 2], y: [1, 2, 3] }, { x: [2, 1, 0], y: [3, 2.5, 1.5] }],
    });
  });
  it(`points only when x turns more than ${MAX_RUNS - 1} times (a jittery thermometer)`, () => {
    expect(drawPlan([1, 2, 1.9, 3, 2.9, 4, 3.9, 5], [1, 2, 3, 4, 5, 6, 7, 8])).toEqual({ kind: 'points' });
  });
});

describe('curveStyle', () => {
  it('gives twelve curves twelve different (colour, dash) pairs and twelve different dash patterns', () => {
    const styles = Array.from({ length: 12 }, (_, i) => curveStyle(i));
    expect(new Set(styles.map((s) => `${s.colour}/${s.dash.join(',')}`)).size).toBe(12);
    expect(new Set(styles.map((s) => s.dash.join(','))).size).toBe(12);
    expect(styles[0]).toEqual({ colour: '#0072B2', dash: [], dashName: 'solid' }); // Okabe–Ito blue
  });
});

describe('renderOverlaySvg', () => {
  const overlay = prepareOverlay([copperFilm, itoFilm, localFile], rhoOfT);
  const svg = renderOverlaySvg(overlay, { logX: false, logY: true, footer: 'Exported from Ohmstead on 2026-12-03' });

  it('is one standalone SVG document with a title naming the axes', () => {
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg" width="960" height="')).toBe(true);
    expect(svg.endsWith('</svg>')).toBe(true);
    expect(svg).toContain('<title>ρ (µΩ·cm) against T (K)</title>');
  });
  it('labels log decades on y (plain from 0.001 to 10⁵, as lib/format) and linear steps on x, with the axis titles', () => {
    for (const label of ['0.1', '1', '10', '100', '1000']) expect(svg).toContain(`text-anchor="end" fill="#1e293b">${label}</text>`);
    for (const label of ['0', '50', '300']) expect(svg).toContain(`text-anchor="middle" fill="#1e293b">${label}</text>`);
    expect(svg).toContain('font-weight="600" fill="#0f172a">T (K)</text>');
  });
  it('draws each curve in its colour and dash pattern', () => {
    expect(svg.match(/<polyline /g)).toHaveLength(3);
    expect(svg).toMatch(/<polyline points="[^"]+" stroke="#0072B2"\/>/);
    expect(svg).toMatch(/<polyline points="[^"]+" stroke="#D55E00" stroke-dasharray="9 4"\/>/);
    expect(svg).toMatch(/<polyline points="[^"]+" stroke="#009E73" stroke-dasharray="2 3"\/>/);
  });
  it('cites every source in the legend (title, then version, DOI, group, file) and escapes markup in names', () => {
    expect(svg).toContain('>1. Resistivity of a 50 nm copper film from 2 K to 300 K</text>');
    expect(svg).toContain('>version 1 — https://doi.org/10.80123/ohm.ab12-cd34 — Larkspur Cryogenic Lab — file LCL-CuF-21_RT_warming.csv</text>');
    expect(svg).toContain('>version 2 — https://doi.org/10.80123/ohm.ef56-gh78 — Tidewater Thin Films Group — file TTF-ITO-040_vdP_warming.csv</text>');
    expect(svg).toContain('>3. my-sample &lt;B&gt;.csv</text>');
    expect(svg).toContain('>your local file (not deposited, no DOI)</text>');
    expect(svg).not.toContain('<B>');
    expect(svg).toContain('Exported from Ohmstead on 2026-12-03</text>');
  });
  it('lists a curve left out by the choices, marked as not shown', () => {
    const normalised = prepareOverlay([localFile, copperFilm], { ...rhoOfT, normalisation: { kind: 'at-x', x: 300 } });
    const out = renderOverlaySvg(normalised, { logX: false, logY: false });
    expect(out).toContain('fill="#64748b">1. my-sample &lt;B&gt;.csv</text>');
    expect(out).toContain('>Not shown with these choices · your local file (not deposited, no DOI)</text>');
    expect(out.match(/<polyline /g)).toHaveLength(1);
  });
  it('places points inside the plot frame (x = 2 K at 96 + 2/300 of the 836 px width)', () => {
    const first = /<polyline points="([\d.]+),([\d.]+)/.exec(svg)!;
    expect(Number(first[1])).toBeCloseTo(96 + (2 / 300) * 836, 1);
  });
});
