import { describe, expect, it } from 'vitest';
import { prefersLogAxis, responseCurveKey, responseCurveSpec, responseRows, titleLines } from './response-curve-spec.ts';

type Layer = { mark: { type: string }; data: { values: Record<string, unknown>[] }; encoding: Record<string, { field?: string; title?: unknown }> };

describe('responseRows', () => {
  it('sorts by x, clips the error bars to [0, 1] and writes the value with its error', () => {
    const rows = responseRows([
      { x: 2, fraction: 0.5, se: 0.01 },
      { x: 1, fraction: 0.005, se: 0.004 },
    ]);
    expect(rows.map((r) => r.x)).toEqual([1, 2]);
    expect(rows[0].lo2).toBe(0);
    expect(rows[0].hi1).toBeCloseTo(0.009, 12);
    // PDG rounding of formatPercentWithError (shared/engine/stats/format.ts): 0.40% → one figure.
    expect(rows[0].text).toBe('0.5% ± 0.4%');
  });
});

describe('responseCurveSpec', () => {
  const base = { points: [{ x: 0, fraction: 0 }, { x: 1, fraction: 0.1 }], xTitle: 'Multiplier m (dimensionless)', yTitle: 'Predicted magnetic fraction (% of white dwarfs)' };

  it('shades the observed band and the allowed range at both levels, 95% first so 68% lies on top', () => {
    const spec = responseCurveSpec({
      ...base,
      band: { name: 'Pilot', fraction: 0.12, interval68: [0.08, 0.16], interval95: [0.05, 0.21] },
      allowed: { level68: [0.9, 1.8], level95: [0.6, 2.3] },
    }) as unknown as { layer: Layer[] };
    const rects = spec.layer.filter((l) => l.mark.type === 'rect');
    expect(rects).toHaveLength(2);
    expect(rects[0].data.values.map((v) => v.level)).toEqual(['95%', '68%']);
    expect(rects[1].encoding.y.field).toBe('lo');
    // Every axis carries its title with the unit.
    const line = spec.layer.find((l) => l.mark.type === 'line')!;
    expect(line.encoding.y.title).toBe(base.yTitle);
    expect(line.encoding.x.title).toBe(base.xTitle);
  });

  it('draws a quoted fraction without intervals as its dashed line (regression: listed in the key but not drawn)', () => {
    const spec = responseCurveSpec({ ...base, band: { name: 'About 10%', fraction: 0.1, interval68: null, interval95: null } }) as unknown as { layer: Layer[] };
    expect(spec.layer.filter((l) => l.mark.type === 'rect')).toHaveLength(0);
    const observed = spec.layer.filter((l) => l.mark.type === 'rule' && l.data.values.some((v) => v.name === 'About 10%'));
    expect(observed).toHaveLength(1);
    expect(observed[0].data.values[0].fraction).toBe(0.1);
  });

  it('draws a range of a single grid value as a line, and error bars only when points carry errors', () => {
    const spec = responseCurveSpec({ ...base, allowed: { level68: [1, 1], level95: null } }) as unknown as { layer: Layer[] };
    expect(spec.layer[0].mark.type).toBe('rule');
    expect(spec.layer.filter((l) => l.mark.type === 'rule')).toHaveLength(1);
  });
});

describe('helpers', () => {
  it('breaks a long title before its unit', () => {
    expect(titleLines('Common-envelope efficiency α_CE (dimensionless)')).toEqual(['Common-envelope efficiency α_CE', '(dimensionless)']);
    expect(titleLines('Reach (AU)')).toBe('Reach (AU)');
  });

  it('prefers a log axis for positive values over a factor of ten', () => {
    expect(prefersLogAxis([0.2, 0.5, 1, 2, 4])).toBe(true);
    expect(prefersLogAxis([0, 1, 2])).toBe(false);
    expect(prefersLogAxis([1, 2, 4])).toBe(false);
  });

  it('keys only what the chart draws', () => {
    const key = responseCurveKey({ points: [{ x: 1, fraction: 0.1 }], band: null, allowed: { level68: [1, 2], level95: null }, predictionLabel: 'Predicted', parameterLabel: 'm' });
    expect(key.map((k) => k.label)).toEqual(['Predicted', 'm allowed at 68%']);
  });
});
