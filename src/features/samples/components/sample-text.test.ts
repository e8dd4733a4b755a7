import { describe, expect, it } from 'vitest';
import type { Sample } from '../../../../shared/contracts/samples.ts';
import { countsInterval, countsText, isIllustrative, sampleValueText } from './sample-text.ts';

const base: Sample = {
  id: 'x', name: 'A survey', library: false, kind: 'counts', magnetic: 9, total: 78, fraction: 9 / 78, fractionSigma: null, lowerBound: false,
  meanMass: null, fieldThresholdMG: 1, setting: 'all', provenance: null, citation: null, bins: [], interval68: null, interval95: null, updatedAt: '2026-01-01T00:00:00Z',
};

describe('countsInterval', () => {
  it('gives the Clopper–Pearson intervals the server gives', () => {
    // Server answer for 9 of 78 (samples.service.ts, clopperPearson at 0.6827 and 0.95).
    const c = countsInterval(9, 78)!;
    expect(c.interval68[0]).toBeCloseTo(0.07865856, 7);
    expect(c.interval95[1]).toBeCloseTo(0.20776792, 7);
    expect(countsText(c)).toBe('9 of 78 (12%; 68%: 7.9–16.4%, 95%: 5.4–21%)');
  });

  it('has no interval for counts that cannot be', () => {
    expect(countsInterval(5, 4)).toBeNull();
    expect(countsInterval(1.5, 4)).toBeNull();
    expect(countsInterval(0, 0)).toBeNull();
    expect(countsInterval(undefined, 10)).toBeNull();
  });
});

describe('sampleValueText', () => {
  it('never shows a quoted fraction without saying what its uncertainty is', () => {
    expect(sampleValueText({ ...base, kind: 'fraction', magnetic: null, total: null, fraction: 0.2, fractionSigma: 0.05 })).toBe('20% ± 5.0% (1σ as quoted)');
    expect(sampleValueText({ ...base, kind: 'fraction', magnetic: null, total: null, fraction: 0.1 })).toBe('about 10% (quoted without an uncertainty)');
    expect(sampleValueText({ ...base, kind: 'fraction', magnetic: null, total: null, fraction: 0.2, lowerBound: true })).toBe('at least 20% (a lower bound)');
  });

  it('writes zero of n with its upper limits', () => {
    expect(sampleValueText({ ...base, magnetic: 0, total: 45, fraction: 0 })).toBe('0 of 45 (0%; 68%: 0–4.0%, 95%: 0–7.9%)');
  });
});

describe('isIllustrative', () => {
  it('finds the word in the name or the provenance', () => {
    expect(isIllustrative({ name: 'Pilot (illustrative)', provenance: null })).toBe(true);
    expect(isIllustrative({ name: 'Pilot', provenance: 'Invented numbers for the demo' })).toBe(true);
    expect(isIllustrative({ name: 'Tout et al. 2008', provenance: 'SDSS' })).toBe(false);
  });
});
