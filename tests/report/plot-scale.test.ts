import { describe, expect, it } from 'vitest';
import {
  axisPrefix,
  decimate,
  linearScale,
  niceAxis,
  niceStep,
  tickLabel,
} from '@/lib/report/plot-scale';

describe('plot scaling', () => {
  it('picks 1-2-5 steps (common practice for axis ticks, no source)', () => {
    expect(niceStep(10, 5)).toBe(2);
    expect(niceStep(1, 5)).toBeCloseTo(0.2, 15);
    expect(niceStep(0.0172, 5)).toBeCloseTo(0.005, 15);
    expect(niceStep(7, 5)).toBe(2);
    expect(niceStep(3.3e-6, 6)).toBeCloseTo(1e-6, 18);
    expect(niceStep(0, 5)).toBe(1);
  });

  it('widens the domain to whole steps and keeps zero on a bipolar axis', () => {
    const a = niceAxis(-0.3578, 0.3578, 5);
    expect(a.min).toBeCloseTo(-0.4, 12);
    expect(a.max).toBeCloseTo(0.4, 12);
    expect(a.ticks).toContain(0);
    expect(a.ticks[0]).toBeCloseTo(-0.4, 12);
    expect(a.ticks.at(-1)).toBeCloseTo(0.4, 12);
    expect(a.prefix).toBe('m');
    // Ticks are exact multiples, never 0.30000000000000004.
    for (const t of a.ticks) expect(String(t).length).toBeLessThan(8);
  });

  it('labels in the axis prefix: a 20 ms AC cycle reads 0…20 ms', () => {
    const a = niceAxis(0, 0.01999, 6);
    expect(a.prefix).toBe('m');
    expect(a.ticks.map((t) => tickLabel(t, a))).toEqual(['0', '5', '10', '15', '20']);
    const surge = niceAxis(0, 545e-6, 6);
    expect(surge.prefix).toBe('µ');
    expect(tickLabel(surge.ticks[1]!, surge)).toBe('100');
    const small = niceAxis(0, 0.0172, 5);
    expect(small.ticks.map((t) => tickLabel(t, small))).toEqual(['0', '5', '10', '15', '20']);
  });

  it('axis prefix by magnitude', () => {
    expect(axisPrefix(0.0167)).toEqual({ factor: 1e-3, prefix: 'm' });
    expect(axisPrefix(1000)).toEqual({ factor: 1e3, prefix: 'k' });
    expect(axisPrefix(358)).toEqual({ factor: 1, prefix: '' });
    expect(axisPrefix(0)).toEqual({ factor: 1, prefix: '' });
  });

  it('a flat trace still gets a span', () => {
    const a = niceAxis(5, 5);
    expect(a.min).toBeLessThan(5);
    expect(a.max).toBeGreaterThan(5);
  });

  it('maps the domain onto the drawing, y upwards', () => {
    const y = linearScale(-10, 10, 240, 20);
    expect(y(-10)).toBe(240);
    expect(y(10)).toBe(20);
    expect(y(0)).toBe(130);
  });

  it('thinning keeps a one-sample spike', () => {
    const t = Array.from({ length: 5000 }, (_, k) => k);
    const v = t.map((k) => (k === 3137 ? 9 : Math.sin(k / 100)));
    const d = decimate(t, v, 400);
    expect(d.t.length).toBeLessThanOrEqual(400);
    expect(Math.max(...d.v)).toBe(9);
    expect(Math.min(...d.v)).toBeCloseTo(Math.min(...v), 12);
    // Time stays in order.
    for (let k = 1; k < d.t.length; k++) expect(d.t[k]!).toBeGreaterThan(d.t[k - 1]!);
  });
});
