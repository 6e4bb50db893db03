/**
 * Structure of the SVG figures (envelopeSvg and the demo's histogramSvg): round ticks
 * (1, 2 or 5 times a power of ten; common practice for plot axes), axis labels, a y scale,
 * title and description for assistive technology, distinguishable line styles with legend
 * swatches, and the stage option. Rendering was looked at in Chromium; these tests pin the
 * structure only.
 */
import { describe, expect, it } from 'vitest';
import { envelopeSvg } from '../../src/checks/envelope-svg.js';
import { roundTicks } from '../../src/checks/svg-ticks.js';
import { histogramSvg } from '../../src/cli/svg.js';
import { InvalidOptionError, InvalidTargetError } from '../../src/core/errors.js';
import { adaptiveRejectionSampler } from '../../src/methods/adaptive-rejection.js';
import { gammaTarget } from '../../src/targets/gamma.js';
import { normalTarget } from '../../src/targets/normal.js';
import { truncate } from '../../src/targets/truncate.js';

/** True when v is k · step with step = {1, 2, 5} · 10^j (within rounding). */
function isRoundStep(step: number): boolean {
  const j = Math.floor(Math.log10(step) + 1e-9);
  const m = step / 10 ** j;
  return [1, 2, 5, 10].some((c) => Math.abs(m - c) < 1e-9);
}

function tickLabels(svg: string, cls: 'x-tick' | 'y-tick'): string[] {
  return [...svg.matchAll(new RegExp(`<text class="${cls}"[^>]*>([^<]*)</text>`, 'g'))].map((m) => m[1]);
}

/** The labels are evenly spaced multiples of a 1-2-5 step, and written without floating-point noise. */
function expectRoundTicks(labels: string[]): void {
  expect(labels.length).toBeGreaterThanOrEqual(3);
  const v = labels.map(Number);
  for (const l of labels) expect(l, `tick label '${l}'`).toMatch(/^-?\d+(\.\d{1,6})?(e-?\d+)?$/);
  const step = v[1] - v[0];
  expect(isRoundStep(Math.abs(step)), `step ${step}`).toBe(true);
  for (let i = 1; i < v.length; i++) expect(Math.abs(v[i] - v[i - 1] - step)).toBeLessThan(1e-9 * Math.max(1, Math.abs(step)));
  for (const x of v) expect(Math.abs(x / step - Math.round(x / step))).toBeLessThan(1e-6);
}

describe('roundTicks', () => {
  it('roundTicks gives 1-2-5 steps: hours 0..24 by 5, 0..1.04 by 0.2, percents 0..100 by 20', () => {
    expect(roundTicks(0, 24, 7).values).toEqual([0, 5, 10, 15, 20]);
    expect(roundTicks(0, 1.04, 6).values).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(roundTicks(0, 1.04, 6).labels).toEqual(['0', '0.2', '0.4', '0.6', '0.8', '1.0']);
    expect(roundTicks(0, 100, 6).values).toEqual([0, 20, 40, 60, 80, 100]);
    expect(roundTicks(-31.4, -1.4, 7).values).toEqual([-30, -25, -20, -15, -10, -5]);
    expect(roundTicks(0, 0.0007, 5).labels).toEqual(['0', '0.0002', '0.0004', '0.0006']);
  });

  it('roundTicks never gives more ticks than asked, and nothing for an empty range (twin: 4.8-style steps are not round)', () => {
    for (const [lo, hi] of [[0, 24], [0, 1], [-3, 7], [1e-9, 3e-9], [12, 12.5], [0, 1e7]]) {
      for (const k of [3, 5, 7, 11]) {
        const t = roundTicks(lo, hi, k);
        expect(t.values.length).toBeLessThanOrEqual(k);
        expect(t.values.length).toBeGreaterThanOrEqual(2);
        expect(isRoundStep(t.step)).toBe(true);
      }
    }
    expect(roundTicks(1, 1).values).toEqual([]);
    expect(isRoundStep(4.8)).toBe(false); // the old hour-of-day step (24/5)
    expect(() => expectRoundTicks(['0', '4.8', '9.6', '14.4'])).toThrow();
  });
});

describe('envelopeSvg figure structure', () => {
  const t = truncate(normalTarget(62, 18), 0, 100);
  const s = adaptiveRejectionSampler(t, { seed: 5 });
  const setup = s.envelope; // snapshot before the first draw
  s.fill(new Float64Array(5000));

  it('envelopeSvg has round x and y ticks, axis labels with units, a title and a description', () => {
    const svg = envelopeSvg(s, t, { xLabel: 'battery charge (%)', title: 'charge & hull' });
    expectRoundTicks(tickLabels(svg, 'x-tick'));
    const y = tickLabels(svg, 'y-tick');
    expectRoundTicks(y);
    expect(y[0]).toBe('0');
    expect(svg).toMatch(/<text class="x-label"[^>]*>battery charge \(%\)<\/text>/);
    expect(svg).toMatch(/<text class="y-label"[^>]*>density relative to the envelope maximum<\/text>/);
    expect(svg).toContain('<title>charge &amp; hull</title>');
    expect(svg).toMatch(/<desc>Plot of battery charge \(%\) against density relative to the envelope maximum[^<]*touch points[^<]*<\/desc>/);
  });

  it('envelopeSvg on the log scale labels logDensity values with round ticks; yLabel overrides the default', () => {
    const svg = envelopeSvg(s, t, { logScale: true, yLabel: 'log f (nats)' });
    expectRoundTicks(tickLabels(svg, 'y-tick'));
    expect(svg).toMatch(/<text class="y-label"[^>]*>log f \(nats\)<\/text>/);
  });

  it('envelopeSvg draws target, envelope and squeeze in different line styles, each with a legend swatch of the same style', () => {
    const svg = envelopeSvg(s, t, { setup });
    const style = (cls: string): string => {
      const m = new RegExp(`<path class="${cls}" d="[^"]*" fill="none" ([^/]*)/>`).exec(svg);
      expect(m, cls).not.toBeNull();
      return (m as RegExpExecArray)[1].trim();
    };
    const styles = ['target', 'envelope', 'squeeze', 'setup-envelope'].map(style);
    expect(new Set(styles).size).toBe(4);
    const width = (st: string): number => Number(/stroke-width="([\d.]+)"/.exec(st)?.[1]);
    // the target is the widest, solid; the envelope narrower and dashed, drawn after (over) it
    expect(width(styles[0])).toBeGreaterThan(width(styles[1]) + 1);
    expect(styles[0]).not.toContain('dasharray');
    expect(styles[1]).toContain('dasharray');
    expect(svg.indexOf('class="target"')).toBeLessThan(svg.indexOf('class="envelope"'));
    const swatches = [...svg.matchAll(/<path class="swatch" d="[^"]*" fill="none" ([^/]*)\/>/g)].map((m) => m[1].trim());
    expect(swatches.sort()).toEqual([...styles].sort());
  });

  it("envelopeSvg stage: 'both' draws the setup envelope and its touch points under the current hull; 'setup' draws only the setup hull", () => {
    const both = envelopeSvg(s, t, { setup, stage: 'both' });
    expect(both).toContain('class="setup-envelope"');
    const hollow = /<g class="setup-touch-points"[^>]*>([\s\S]*?)<\/g>/.exec(both);
    expect(hollow).not.toBeNull();
    expect(((hollow as RegExpExecArray)[1].match(/<circle /g) ?? []).length).toBe(setup.touchPoints.length);
    expect(both).toContain(`${s.envelope.touchPoints.length} touch points (setup: ${setup.touchPoints.length}, hollow)`);
    const only = envelopeSvg(s, t, { setup, stage: 'setup' });
    expect(only).not.toContain('class="setup-envelope"');
    expect(only).toContain(`${setup.touchPoints.length} touch points`);
    expect(only).toContain('envelope, setup hull');
    const current = envelopeSvg(s, t);
    expect(current).not.toContain('setup');
    expect(current).toContain(`${s.envelope.touchPoints.length} touch points`);
    expect(s.envelope.touchPoints.length).toBeGreaterThan(setup.touchPoints.length); // adaptation added points
  });

  it('envelopeSvg refuses bad stage, setup and label options and unknown keys with InvalidOptionError naming the option', () => {
    expect(() => envelopeSvg(s, t, { stage: 'setup' })).toThrow(/options.stage 'setup' needs options.setup/);
    expect(() => envelopeSvg(s, t, { stage: 'later' as never, setup })).toThrow(/options.stage must be 'current', 'setup' or 'both', got 'later'/);
    expect(() => envelopeSvg(s, t, { setup: {} as never })).toThrow(InvalidOptionError);
    expect(() => envelopeSvg(s, t, { stage: 'later' as never, setup })).toThrow(InvalidOptionError);
    expect(() => envelopeSvg(s, t, { logscale: true } as never)).toThrow(/envelopeSvg: unknown option 'logscale' \(known: 'width', /);
    expect(() => envelopeSvg(s, t, { logscale: true } as never)).toThrow(InvalidOptionError);
    // twin: a malformed source stays a target error
    expect(() => envelopeSvg({} as never, t)).toThrow(InvalidTargetError);
    expect(() => envelopeSvg(s, t, { xLabel: 3 as never })).toThrow(/options.xLabel must be a string/);
  });

  it('envelopeSvg on a gamma target with the default range still gets round ticks (twin of the tick check: a 4.8 step fails it)', () => {
    const g = gammaTarget(2.5);
    const svg = envelopeSvg(adaptiveRejectionSampler(g, { seed: 1 }), g);
    expectRoundTicks(tickLabels(svg, 'x-tick'));
  });
});

describe('histogramSvg figure structure (demo figures)', () => {
  const draws = new Float64Array(2000).map((_, i) => (24 * (i + 0.5)) / 2000);
  const fig = histogramSvg({
    draws,
    density: () => 1 / 24,
    envelope: () => 1.1 / 24,
    lower: 0,
    upper: 24,
    bins: 48,
    title: 'start times',
    xLabel: 'hour of day (h)',
    yLabel: 'density (per hour)',
  });

  it('histogramSvg hour-of-day axis has round ticks (0, 5, 10, ...) and a y scale with round ticks from 0', () => {
    const x = tickLabels(fig, 'x-tick');
    expectRoundTicks(x);
    expect(x).not.toContain('4.8');
    const y = tickLabels(fig, 'y-tick');
    expectRoundTicks(y);
    expect(y[0]).toBe('0');
  });

  it('histogramSvg has axis labels, a title, a description and legend swatches for bars, density and envelope', () => {
    expect(fig).toMatch(/<text class="x-label"[^>]*>hour of day \(h\)<\/text>/);
    expect(fig).toMatch(/<text class="y-label"[^>]*>density \(per hour\)<\/text>/);
    expect(fig).toContain('<title>start times</title>');
    expect(fig).toMatch(/<desc>Histogram of 2000 draws of hour of day \(h\)/);
    const density = /<path class="density" d="[^"]*" fill="none" ([^/]*)\/>/.exec(fig)?.[1].trim();
    const envelope = /<path class="envelope" d="[^"]*" fill="none" ([^/]*)\/>/.exec(fig)?.[1].trim();
    expect(density).toBeDefined();
    expect(envelope).toBeDefined();
    expect(density).not.toBe(envelope);
    const swatches = [...fig.matchAll(/<path class="swatch" d="[^"]*" fill="none" ([^/]*)\/>/g)].map((m) => m[1].trim());
    expect(swatches).toEqual([density, envelope]);
    expect(fig).toContain('draws (2000), as a density');
  });
});
