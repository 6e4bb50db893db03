/**
 * envelopeSvg: a well-formed SVG with the three curves and the touch points.
 */
import { describe, expect, it } from 'vitest';
import { envelopeSvg } from '../../src/checks/envelope-svg.js';
import { InvalidTargetError } from '../../src/core/errors.js';
import { adaptiveRejectionSampler } from '../../src/methods/adaptive-rejection.js';
import { gammaTarget } from '../../src/targets/gamma.js';
import { normalTarget } from '../../src/targets/normal.js';

/** Coordinates of a path's "M x y" / "L x y" commands. */
function coords(d: string): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  const re = /[ML](-?[\d.]+) (-?[\d.]+)/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(d)) !== null) out.push([Number(m[1]), Number(m[2])]);
  return out;
}

function pathOf(svg: string, cls: string): string {
  const m = new RegExp(`<path class="${cls}" d="([^"]*)"`).exec(svg);
  expect(m, `path ${cls}`).not.toBeNull();
  return (m as RegExpExecArray)[1];
}

describe('envelopeSvg', () => {
  it('envelopeSvg(sampler, target) draws envelope above target above squeeze, with one marker per touch point', () => {
    const t = gammaTarget(2.5);
    const s = adaptiveRejectionSampler(t, { seed: 1 });
    const svg = envelopeSvg(s, t, { width: 500, height: 300, points: 200, title: 'gamma <2.5> & hull' });
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(svg.trim().endsWith('</svg>')).toBe(true);
    expect(svg).toContain('<title>gamma &lt;2.5&gt; &amp; hull</title>');
    expect(svg).toContain('aria-label="gamma &lt;2.5&gt; &amp; hull"');
    const env = coords(pathOf(svg, 'envelope'));
    const tgt = coords(pathOf(svg, 'target'));
    expect(env.length).toBe(200);
    expect(tgt.length).toBe(199); // the gamma(2.5) density is 0 at x = 0, the first grid point: the line starts after it
    // SVG y grows downwards: the envelope is drawn at or above (smaller y) the target, the squeeze at or below
    const envAt = new Map(env.map(([x, y]) => [x, y]));
    for (const [x, y] of tgt) expect(envAt.get(x) as number).toBeLessThanOrEqual(y + 0.02);
    const sq = coords(pathOf(svg, 'squeeze'));
    expect(sq.length).toBeGreaterThan(0);
    const tgtAt = new Map(tgt.map(([x, y]) => [x, y]));
    for (const [x, y] of sq) expect(y).toBeGreaterThanOrEqual((tgtAt.get(x) as number) - 0.02);
    const [lo, hi] = [0, Infinity];
    const inRange = s.envelope.touchPoints.filter((x) => x >= lo && x <= hi);
    const marks = /<g class="touch-points"[^>]*>([\s\S]*?)<\/g>/.exec(svg);
    expect(marks).not.toBeNull();
    const circles = ((marks as RegExpExecArray)[1].match(/<circle /g) ?? []).length;
    expect(circles).toBeLessThanOrEqual(inRange.length);
    expect(circles).toBeGreaterThan(0);
  });

  it('envelopeSvg accepts a description, a range and a log scale', () => {
    const t = normalTarget(0, 1);
    const s = adaptiveRejectionSampler(t, { seed: 2, transform: 'inverse-sqrt' });
    s.fill(new Float64Array(1000));
    const svg = envelopeSvg(s.envelope, t, { range: [-6, 6], logScale: true });
    expect(svg).toContain('inverse-sqrt');
    expect(coords(pathOf(svg, 'envelope')).length).toBeGreaterThan(100);
  });

  it('envelopeSvg rejects bad inputs with InvalidTargetError', () => {
    const t = normalTarget(0, 1);
    const s = adaptiveRejectionSampler(t);
    expect(() => envelopeSvg(null as never, t)).toThrow(InvalidTargetError);
    expect(() => envelopeSvg(s, {} as never)).toThrow(InvalidTargetError);
    expect(() => envelopeSvg(s, t, { width: 10 })).toThrow(/options.width/);
    expect(() => envelopeSvg(s, t, { range: [1, 0] })).toThrow(/options.range/);
  });
});
