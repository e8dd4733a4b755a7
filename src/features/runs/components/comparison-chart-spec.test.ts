import { describe, expect, it } from 'vitest';
import { comparisonRows, OBSERVED_KIND, PREDICTED_KIND, shortSampleLabel } from './comparison-chart-spec.ts';

describe('comparisonRows', () => {
  it('gives each sample an observed row with its intervals and a predicted row with ±1 and ±2 errors', () => {
    const [observed, predicted] = comparisonRows([
      {
        label: 'all white dwarfs',
        observed: { magnetic: 9, total: 78, fraction: 9 / 78, interval68: [0.079, 0.163], interval95: [0.054, 0.208] },
        predicted: { value: 0.0903, se: 0.0009 },
      },
    ]);
    expect(observed).toMatchObject({ label: 'All', kind: OBSERVED_KIND, innerLo: 0.079, outerHi: 0.208, text: '9 of 78 (12%)' });
    expect(predicted.kind).toBe(PREDICTED_KIND);
    expect(predicted.innerLo).toBeCloseTo(0.0894, 12);
    expect(predicted.outerHi).toBeCloseTo(0.0921, 12);
    expect(predicted.text).toBe('9.03% ± 0.09%');
  });
});

describe('shortSampleLabel', () => {
  // The labels the server writes (server/modules/runs/comparison.ts, predictedFor and predictedInMassRange).
  it('shortens each kind of label for an axis', () => {
    expect(shortSampleLabel('all white dwarfs')).toBe('All');
    expect(shortSampleLabel('single white dwarfs (no surviving companion)')).toBe('Single');
    expect(shortSampleLabel('white dwarfs with a wide (never engulfed) companion')).toBe('With a wide companion');
    expect(shortSampleLabel('white dwarfs with a detached companion (wide or post-common-envelope)')).toBe('With a detached companion');
    expect(shortSampleLabel('white dwarfs of 0.5–0.7 Msun')).toBe('0.5–0.7 Msun');
  });
});
