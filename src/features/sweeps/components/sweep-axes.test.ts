import { describe, expect, it } from 'vitest';
import { axisFieldErrors, axisValues, evenlySpaced, gridPointCount, gridTooLarge, newAxisDraft, parameterApplies, parameterTitle, sweepFieldKey, type AxisDraft } from './sweep-axes.ts';

const draft = (over: Partial<AxisDraft>): AxisDraft => ({ ...newAxisDraft('envelope.alpha'), ...over });

describe('evenlySpaced', () => {
  it('spaces values evenly and writes them tidily', () => {
    expect(evenlySpaced(0.1, 0.5, 5, 'linear')).toEqual([0.1, 0.2, 0.3, 0.4, 0.5]);
  });

  it('spaces them evenly in the logarithm when asked', () => {
    expect(evenlySpaced(0.1, 10, 3, 'log')).toEqual([0.1, 1, 10]);
  });
});

describe('axisValues', () => {
  it('gives the values of a range', () => {
    expect(axisValues(draft({ start: '0.5', stop: '2', count: '4' }))).toEqual({ values: [0.5, 1, 1.5, 2] });
  });

  it('reads a list in any order', () => {
    expect(axisValues(draft({ mode: 'list', list: '1, 0.5 2;4' }))).toEqual({ values: [1, 0.5, 2, 4] });
  });

  it('names the allowed range of the parameter when a value lies outside it', () => {
    // envelope.alpha is bounded to 0.01 … 10 by the scenario schema (SWEEPABLE_PARAMETERS reads it from there).
    expect(axisValues(draft({ mode: 'list', list: '1, 20' })).error).toBe('Common-envelope efficiency α_CE must be from 0.01 to 10 (got 20).');
  });

  it('refuses too few or repeated values, words, and log spacing through zero', () => {
    expect(axisValues(draft({ mode: 'list', list: '1' })).error).toMatch(/2 to 25 values/);
    expect(axisValues(draft({ mode: 'list', list: '1, 1' })).error).toMatch(/once/);
    expect(axisValues(draft({ mode: 'list', list: '1, two' })).error).toMatch(/numbers only/);
    expect(axisValues(draft({ count: '30' })).error).toMatch(/2 to 25/);
    expect(axisValues({ ...newAxisDraft('companions.multiplier'), start: '0', stop: '2', spacing: 'log' }).error).toMatch(/above 0/);
  });
});

describe('newAxisDraft', () => {
  it('starts from half to twice the scenario’s own value, inside the allowed range', () => {
    const axis = newAxisDraft('envelope.alpha', 8);
    expect([axis.start, axis.stop]).toEqual(['4', '10']);
  });

  it('spans the whole allowed range without a value to start from', () => {
    const axis = newAxisDraft('disruption.eta');
    expect([axis.start, axis.stop]).toEqual(['0.1', '5']);
  });
});

describe('grid', () => {
  it('multiplies the axes and says when the grid is too large', () => {
    const points = gridPointCount([{ values: [1, 2, 3] }, { values: Array.from({ length: 25 }, (_, i) => i) }]);
    expect(points).toBe(75);
    expect(gridTooLarge(points)).toBeNull();
    expect(gridTooLarge(125)).toMatch(/at most 100/);
    expect(gridPointCount([{ values: [1, 2] }, { error: 'x' }])).toBeNull();
  });
});

describe('sweepFieldKey', () => {
  it('shows a bad value of an axis at that axis', () => {
    expect(sweepFieldKey('axes[0].values[2]')).toBe('axes.0.values');
    expect(sweepFieldKey('axes.1.path')).toBe('axes.1.path');
    expect(sweepFieldKey('systems')).toBe('systems');
  });
});

describe('parameters', () => {
  it('applies only where the scenario has the number', () => {
    const doc = { giant: { kind: 'fixedReach', reachAU: 3 }, envelope: { alpha: 1 } };
    expect(parameterApplies(doc, 'giant.reachAU')).toBe(true);
    expect(parameterApplies(doc, 'giant.reimersEta')).toBe(false);
  });

  it('titles an axis with its unit, or says it has none', () => {
    expect(parameterTitle({ label: 'Engulfment reach', unit: 'AU' })).toBe('Engulfment reach (AU)');
    expect(parameterTitle({ label: 'Tidal-radius factor η', unit: '' })).toBe('Tidal-radius factor η (dimensionless)');
  });
});

describe('axisFieldErrors', () => {
  const alpha = (patch: Partial<AxisDraft>): AxisDraft => ({ ...newAxisDraft('envelope.alpha'), ...patch });

  it('reports every problem of a range at once, each at its own input (regression: one at a time, the count under Start)', () => {
    // envelope.alpha is bounded to 0.01 … 10 by the scenario schema.
    expect(axisFieldErrors(alpha({ start: '0', stop: '50', count: '40' }))).toEqual({
      start: 'Start must be from 0.01 to 10 (got 0).',
      stop: 'Stop must be from 0.01 to 10 (got 50).',
      count: 'The number of values must be a whole number from 2 to 25 (got 40).',
    });
    expect(axisFieldErrors(alpha({ start: '', stop: 'x', count: '5' }))).toEqual({
      start: 'Give a start from 0.01 to 10.',
      stop: 'Stop must be a number from 0.01 to 10 (got “x”).',
    });
    expect(axisFieldErrors(alpha({ start: '1', stop: '1', count: '5' }))).toEqual({ stop: 'Stop must differ from start.' });
    expect(axisFieldErrors(alpha({ start: '0.5', stop: '2', count: '4' }))).toEqual({});
  });

  it('names every value of a list outside the allowed range', () => {
    expect(axisFieldErrors(alpha({ mode: 'list', list: '1, 20, 30' }))).toEqual({ list: 'Common-envelope efficiency α_CE must be from 0.01 to 10 (got 20, 30).' });
  });
});
