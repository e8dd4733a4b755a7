import { describe, expect, it } from 'vitest';
// @ts-ignore -- jstat (dev dependency, the reference library) ships no type declarations
import jstat from 'jstat';
import { normalQuantile } from '../numerics/normal-quantile.ts';
import { standardNormalCdf } from '../numerics/normal-cdf.ts';
import { chunkUniform } from '../random.ts';
import { flatSample, powerLawInLogSample, truncatedLognormalPeriodDays } from './companion-distribution.ts';

const { jStat } = jstat as { jStat: { normal: { cdf(x: number, m: number, s: number): number } } };

function ks(samples: number[], cdf: (x: number) => number): number {
  const s = samples.slice().sort((a, b) => a - b);
  let d = 0;
  s.forEach((x, i) => {
    const f = cdf(x);
    d = Math.max(d, Math.abs(f - i / s.length), Math.abs((i + 1) / s.length - f));
  });
  return d;
}

const N = 20000;
// P(√N D > 1.95) ≈ 0.001 (Kolmogorov distribution); fixed seeds.
const BOUND = 1.95 / Math.sqrt(N);

describe('companion-row sampling', () => {
  it('Cumming et al. 2008 period law dN ∝ P^0.26 dlnP on [2, 2000] d follows its analytic CDF', () => {
    const u = chunkUniform('ks-period', 0);
    const samples = Array.from({ length: N }, () => powerLawInLogSample(2, 2000, 0.26, u()));
    const cdf = (p: number) => (Math.pow(p, 0.26) - Math.pow(2, 0.26)) / (Math.pow(2000, 0.26) - Math.pow(2, 0.26));
    expect(ks(samples, cdf)).toBeLessThan(BOUND);
  });

  it('log-uniform (exponent 0) masses follow ln-uniform', () => {
    const u = chunkUniform('ks-mass', 0);
    const samples = Array.from({ length: N }, () => powerLawInLogSample(0.3, 10, 0, u()));
    expect(ks(samples, (m) => Math.log(m / 0.3) / Math.log(10 / 0.3))).toBeLessThan(BOUND);
  });

  it('Raghavan et al. 2010 log-normal periods truncated to [1, 1e6] d follow the truncated normal CDF (jStat)', () => {
    const [mean, sigma] = [5.03, 2.28];
    const a = standardNormalCdf((0 - mean) / sigma);
    const b = standardNormalCdf((6 - mean) / sigma);
    const u = chunkUniform('ks-lognormal', 0);
    const samples = Array.from({ length: N }, () => truncatedLognormalPeriodDays(mean, sigma, a, b - a, u(), normalQuantile));
    const ja = jStat.normal.cdf(0, mean, sigma);
    const jb = jStat.normal.cdf(6, mean, sigma);
    expect(ks(samples, (p) => (jStat.normal.cdf(Math.log10(p), mean, sigma) - ja) / (jb - ja))).toBeLessThan(BOUND);
    expect(Math.min(...samples)).toBeGreaterThanOrEqual(1 - 1e-9);
    expect(Math.max(...samples)).toBeLessThanOrEqual(1e6 * (1 + 1e-9));
  });

  it('flat draws', () => {
    expect(flatSample(0.1, 1, 0.5)).toBeCloseTo(0.55, 12);
  });
});
