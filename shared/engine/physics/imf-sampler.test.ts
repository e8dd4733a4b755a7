import { describe, expect, it } from 'vitest';
// @ts-ignore -- jstat (dev dependency, the reference library) ships no type declarations
import jstat from 'jstat';
import { chunkUniform } from '../random.ts';
import { buildImfSampler, sampleImfMsun } from './imf-sampler.ts';
import { powerLawPieceMsun } from './imf-power-law.ts';

const { jStat } = jstat as { jStat: { normal: { cdf(x: number, m: number, s: number): number } } };

/** Composite Simpson's rule of f on [a, b] in ln x with 2n intervals (the densities are smooth in ln M). */
function integrateLog(f: (m: number) => number, a: number, b: number, n = 2000): number {
  const la = Math.log(a);
  const h = (Math.log(b) - la) / (2 * n);
  let sum = 0;
  for (let i = 0; i <= 2 * n; i++) {
    const m = Math.exp(la + i * h);
    const w = i === 0 || i === 2 * n ? 1 : i % 2 === 1 ? 4 : 2;
    sum += w * f(m) * m; // dM = M dln M
  }
  return (sum * h) / 3;
}

/** Kroupa (2001) eq. 2 written out from the published slopes, continuous at 0.08 and 0.5 Msun. */
function kroupaDensity(m: number): number {
  if (m < 0.08) return Math.pow(m / 0.08, -0.3) * Math.pow(0.08 / 0.5, -1.3);
  if (m < 0.5) return Math.pow(m / 0.5, -1.3);
  return Math.pow(m / 0.5, -2.3);
}

/** Kolmogorov–Smirnov distance between sorted samples and a CDF. */
function ksDistance(sorted: number[], cdf: (x: number) => number): number {
  let d = 0;
  const n = sorted.length;
  sorted.forEach((x, i) => {
    const f = cdf(x);
    d = Math.max(d, Math.abs(f - i / n), Math.abs((i + 1) / n - f));
  });
  return d;
}

function draw(sampler: ReturnType<typeof buildImfSampler>, n: number, seed: string): number[] {
  const u = chunkUniform(seed, 0);
  return Array.from({ length: n }, () => sampleImfMsun(sampler, u())).sort((a, b) => a - b);
}

// KS: P(√N D_N > 1.95) ≈ 0.001 for a correct sampler (Kolmogorov distribution); the seed is fixed.
const KS_FACTOR = 1.95;

describe('IMF sampling', () => {
  it('Kroupa (2001): piece weights equal the quadrature of the published broken power law', () => {
    const sampler = buildImfSampler({ law: 'kroupa2001' }, [0.01, 8]);
    // Integrated piece by piece (the density has kinks at the breaks): Simpson with 4000
    // intervals on each smooth piece is good to ≪ 1e-9, so 8 digits only covers rounding.
    const pieces = [integrateLog(kroupaDensity, 0.01, 0.08), integrateLog(kroupaDensity, 0.08, 0.5), integrateLog(kroupaDensity, 0.5, 8)];
    const total = pieces[0] + pieces[1] + pieces[2];
    const below008 = pieces[0] / total;
    const below05 = (pieces[0] + pieces[1]) / total;
    expect(sampler.cumulative[0]).toBeCloseTo(below008, 8);
    expect(sampler.cumulative[1]).toBeCloseTo(below05, 8);
    // The share of 0.08–8 Msun stars above 1 Msun quoted in imf-kroupa2001.ts (≈ 0.091).
    const above1 = integrateLog(kroupaDensity, 1, 8) / (integrateLog(kroupaDensity, 0.08, 0.5) + integrateLog(kroupaDensity, 0.5, 8));
    expect(above1).toBeCloseTo(0.0912, 3);
  });

  it('Salpeter (1955) on [1, 8] follows the analytic CDF (KS distance within its 0.1% bound)', () => {
    const n = 20000;
    const samples = draw(buildImfSampler({ law: 'salpeter1955' }, [1, 8]), n, 'ks-salpeter');
    const cdf = (m: number) => (1 - Math.pow(m, -1.35)) / (1 - Math.pow(8, -1.35));
    expect(ksDistance(samples, cdf)).toBeLessThan(KS_FACTOR / Math.sqrt(n));
  });

  it('Kroupa (2001) on [0.05, 8] follows the quadrature CDF', () => {
    const n = 20000;
    const samples = draw(buildImfSampler({ law: 'kroupa2001' }, [0.05, 8]), n, 'ks-kroupa');
    const cdfUpTo = (m: number) => (m <= 0.08 ? integrateLog(kroupaDensity, 0.05, m, 100) : m <= 0.5 ? integrateLog(kroupaDensity, 0.05, 0.08, 100) + integrateLog(kroupaDensity, 0.08, m, 100) : integrateLog(kroupaDensity, 0.05, 0.08, 100) + integrateLog(kroupaDensity, 0.08, 0.5, 100) + integrateLog(kroupaDensity, 0.5, m, 100));
    const total = cdfUpTo(8);
    const cdf = (m: number) => cdfUpTo(m) / total;
    expect(ksDistance(samples.filter((_, i) => i % 20 === 0), cdf)).toBeLessThan(KS_FACTOR / Math.sqrt(n / 20));
  });

  it('Chabrier (2003): log-normal part (tabulated) and power law agree with the analytic CDF across 1 Msun', () => {
    // Analytic: below 1 Msun ξ(log m) is Gaussian in log m (Table 1: 0.158, log 0.079, σ 0.69),
    // above it 4.43e-2 m^-1.3 per log m; the weights of the parts are computed here from those numbers.
    const sigma = 0.69;
    const mu = Math.log10(0.079);
    const gauss = (x: number) => jStat.normal.cdf(x, mu, sigma) * 0.158 * sigma * Math.sqrt(2 * Math.PI);
    const lo = 0.1;
    const hi = 8;
    const lognormalPart = gauss(0) - gauss(Math.log10(lo));
    const powerPart = (4.43e-2 / (1.3 * Math.LN10)) * (1 - Math.pow(hi, -1.3));
    const total = lognormalPart + powerPart;
    const cdf = (m: number) =>
      m <= 1 ? (gauss(Math.log10(m)) - gauss(Math.log10(lo))) / total : (lognormalPart + (4.43e-2 / (1.3 * Math.LN10)) * (1 - Math.pow(m, -1.3))) / total;
    const sampler = buildImfSampler({ law: 'chabrier2003' }, [lo, hi]);
    // The table's trapezoid quadrature (4096 steps) is good to ~1e-7 of the weight.
    expect(sampler.cumulative[0]).toBeCloseTo(lognormalPart / total, 5);
    const n = 40000;
    expect(ksDistance(draw(sampler, n, 'ks-chabrier'), cdf)).toBeLessThan(KS_FACTOR / Math.sqrt(n));
  });

  it('a user broken power law matches the equivalent Kroupa law', () => {
    const a = buildImfSampler({ law: 'brokenPowerlaw', breaksMsun: [0.08, 0.5], slopes: [0.3, 1.3, 2.3] }, [0.05, 8]);
    const b = buildImfSampler({ law: 'kroupa2001' }, [0.05, 8]);
    expect(a).toEqual(b);
  });

  it('inverts the power law exactly, including slope 1 (log-uniform)', () => {
    // slope 2.35 on [1, 8], u = 0.5: (1 + 0.5 (8^-1.35 − 1))^(-1/1.35), evaluated by hand ≈ 1.600.
    expect(powerLawPieceMsun(1, 8, 2.35, 0.5)).toBeCloseTo(Math.pow(1 + 0.5 * (Math.pow(8, -1.35) - 1), -1 / 1.35), 12);
    expect(powerLawPieceMsun(1, 100, 1, 0.5)).toBeCloseTo(10, 10);
    expect(powerLawPieceMsun(2, 5, 2.35, 0)).toBeCloseTo(2, 12);
    expect(powerLawPieceMsun(2, 5, 2.35, 1)).toBeCloseTo(5, 12);
  });
});
