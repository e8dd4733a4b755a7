import { describe, expect, it } from 'vitest';
import { observedConstraintSchema, type ObservedConstraint } from '../../../shared/contracts/constraints.ts';
import { binomialTestTwoSided } from '../../../shared/engine/stats/binomial-test.ts';
import { fisherCombination } from '../../../shared/engine/stats/fisher-combination.ts';
import { sigmaFromTwoSidedP } from '../../../shared/engine/stats/significance.ts';
import { evaluateConstraints, type EvaluableResult } from './evaluate.ts';

const SET = { id: 'test', name: 'Synthetic', version: 1 };
const edges = (lo: number, hi: number, n: number) => Array.from({ length: n + 1 }, (_, i) => lo + ((hi - lo) * i) / n);

/** A today's-shape (engine 1) result: settings, 0.02 Msun mass bins, 0.1 dex field bins. */
function engineOne(opts: { single?: [number, number]; wide?: [number, number]; postCE?: [number, number]; magneticMass?: number[]; nonMagneticMass?: number[] } = {}): EvaluableResult {
  const [sk, sn] = opts.single ?? [9_000, 100_000];
  const [wk, wn] = opts.wide ?? [1_000, 10_000];
  const [pk, pn] = opts.postCE ?? [5_000, 50_000];
  const massEdges = edges(0.2, 1.4, 60);
  return {
    counts: {
      whiteDwarfs: sn + wn + pn,
      magnetic: sk + wk + pk,
      bySetting: { single: { whiteDwarfs: sn, magnetic: sk }, wide: { whiteDwarfs: wn, magnetic: wk }, postCE: { whiteDwarfs: pn, magnetic: pk } },
    },
    bins: {
      wdMass: { edgesMsun: massEdges, magnetic: opts.magneticMass ?? new Array(60).fill(0), nonMagnetic: opts.nonMagneticMass ?? new Array(60).fill(0) },
      logField: { edgesLog10MG: edges(-2, 4, 60), counts: new Array(60).fill(100), thresholdMG: 1 },
    },
  };
}

const parse = (c: Record<string, unknown>) => observedConstraintSchema.parse(c) as ObservedConstraint;
const resolved = (...cs: Record<string, unknown>[]) => cs.map((c, i) => ({ id: `c${i + 1}`, constraint: parse(c), citation: null }));

describe('evaluateConstraints: fraction', () => {
  it('rejects a model with 10% magnetic post-CE white dwarfs against 0 of 1253 at σ > 5 (exact binomial, as R binom.test)', () => {
    // The binomial test of 0 of 1253 at p = 0.1 is (0.9)^1253 plus the far tail — far below 5σ's 5.7e-7.
    const e = evaluateConstraints(engineOne(), resolved({ kind: 'fraction', setting: 'postCE', magnetic: 0, total: 1253 }), SET);
    const c = e.constraints[0];
    expect(c.status).toBe('scored');
    expect(c.sigma!).toBeGreaterThan(5);
    expect(c.p!).toBeLessThan(0.9 ** 1253 * 2);
    // ln Binomial(0 | 1253, 0.1) = 1253 ln 0.9 (by hand).
    expect(c.logLikelihood!).toBeCloseTo(1253 * Math.log(0.9), 8);
    expect(c.verdict).toMatch(/^Rejected/);
  });

  it('finds 149 of 1500 consistent with a predicted 10% and equal to the binomial test of R binom.test', () => {
    const e = evaluateConstraints(engineOne(), resolved({ kind: 'fraction', setting: 'single', magnetic: 149, total: 1500 }), SET);
    const c = e.constraints[0];
    // The prediction is 9000/100000 = 0.09; binom.test(149, 1500, 0.09) through the engine's own exact test.
    expect(c.p).toBeCloseTo(binomialTestTwoSided(149, 1500, 0.09), 14);
    expect(c.sigma!).toBeLessThan(2);
  });

  it('tests a published value ± error with the Monte Carlo error in quadrature', () => {
    // Model 15000/160000 = 0.09375, se = √(f(1−f)/n) = 7.29e-4; against 0.10 ± 0.02: z = −0.3120, p = 0.755 (two-sided normal).
    const e = evaluateConstraints(engineOne(), resolved({ kind: 'fraction', setting: 'all', value: 0.1, error: 0.02 }), SET);
    const f = 15000 / 160000;
    const se = Math.sqrt((f * (1 - f)) / 160000);
    const z = (f - 0.1) / Math.hypot(0.02, se);
    expect(e.constraints[0].sigma!).toBeCloseTo(Math.abs(z), 10);
    expect(e.constraints[0].verdict).toMatch(/^Consistent/);
  });

  it('checks a lower bound without scoring it', () => {
    const e = evaluateConstraints(engineOne(), resolved({ kind: 'fraction', setting: 'all', value: 0.2, bound: 'lower' }), SET);
    expect(e.constraints[0].status).toBe('notTestable');
    expect(e.constraints[0].verdict).toMatch(/Falls short/);
    expect(e.combined.scored).toBe(0);
  });

  it('flags mcLimited only when ±1 SE moves σ by more than 0.1', () => {
    // 50 of 500 model white dwarfs (se = 0.0134) against 10 of 200: σ moves by several tenths.
    const small = evaluateConstraints(engineOne({ single: [50, 500] }), resolved({ kind: 'fraction', setting: 'single', magnetic: 10, total: 200 }), SET);
    expect(small.constraints[0].mcLimited).toBe(true);
    // 1e7 model white dwarfs (se = 9.5e-5) against the same: σ moves by ~0.01.
    const big = evaluateConstraints(engineOne({ single: [1_000_000, 10_000_000] }), resolved({ kind: 'fraction', setting: 'single', magnetic: 10, total: 200 }), SET);
    expect(big.constraints[0].mcLimited).toBe(false);
  });
});

describe('evaluateConstraints: masses', () => {
  // Model masses: magnetic N(0.80, 0.10), non-magnetic N(0.62, 0.10), on the 0.02 Msun bins, 1e5 each.
  const normalCounts = (mean: number, sd: number, total: number) =>
    edges(0.2, 1.4, 60).slice(0, 60).map((a) => {
      const b = a + 0.02;
      const phi = (x: number) => 0.5 * (1 + erf((x - mean) / (sd * Math.SQRT2)));
      return Math.round(total * (phi(b) - phi(a)));
    });
  const result = engineOne({ magneticMass: normalCounts(0.8, 0.1, 100_000), nonMagneticMass: normalCounts(0.62, 0.1, 100_000) });

  it('tests a published mean ± error against the grouped mean (Ferrario et al. 2015 numbers)', () => {
    const e = evaluateConstraints(result, resolved({ kind: 'meanMass', population: 'magnetic', meanMsun: 0.784, errorMsun: 0.047 }), SET);
    const c = e.constraints[0];
    // Model mean 0.800 (to 1e-4 after rounding counts); z = 0.016/√(0.047² + se²) ≈ 0.34.
    expect(c.sigma!).toBeGreaterThan(0.3);
    expect(c.sigma!).toBeLessThan(0.38);
  });

  it('accepts masses drawn from the model and rejects masses from the other population (grouped KS)', () => {
    // Quantiles of N(0.80, 0.10) at (i − ½)/40: a sample that follows the model exactly.
    const quantiles = Array.from({ length: 40 }, (_, i) => 0.8 + 0.1 * inverseNormal((i + 0.5) / 40));
    const ok = evaluateConstraints(result, resolved({ kind: 'meanMass', population: 'magnetic', massesMsun: quantiles }), SET).constraints[0];
    expect(ok.sigma!).toBeLessThan(1);
    expect(ok.overlay?.chart).toBe('wdMass');
    expect(ok.overlay?.observed.reduce((a, b) => a + b, 0)).toBe(40);
    // The same list against the non-magnetic model (0.18 Msun lower, 1.8 sd): D ≈ Φ(0.9) − Φ(−0.9) ≈ 0.63 over 40 values.
    const bad = evaluateConstraints(result, resolved({ kind: 'meanMass', population: 'nonMagnetic', massesMsun: quantiles }), SET).constraints[0];
    expect(bad.sigma!).toBeGreaterThan(5);
  });

  it('reports a setting split as unavailable on an engine-1 result, never as 0', () => {
    const e = evaluateConstraints(result, resolved({ kind: 'meanMass', setting: 'postCE', meanMsun: 0.45, errorMsun: 0.05 }), SET);
    expect(e.constraints[0].status).toBe('unavailable');
    expect(e.constraints[0].verdict).toBe('not available for this run (needs engine 2)');
    expect(e.constraints[0].p).toBeNull();
    expect(e.combined.scored).toBe(0);
  });
});

describe('evaluateConstraints: fields', () => {
  it('compares fields above the survey threshold only, and reads the engine-2 split by channel when present', () => {
    // Engine 1: a flat histogram of log10 B from −2 to 4 (0.1 dex bins). Fields drawn flat in log10 B
    // above 1 MG follow it: 8 values at 10^(0.25 + 0.5 i) MG, evenly spread over 0 … 4 dex → consistent.
    const fields = Array.from({ length: 8 }, (_, i) => Math.pow(10, 0.25 + 0.5 * i));
    const flat = evaluateConstraints(engineOne(), resolved({ kind: 'fieldDistribution', thresholdMG: 1, fieldsMG: [0.2, ...fields] }), SET).constraints[0];
    expect(flat.status).toBe('scored');
    expect(flat.sigma!).toBeLessThan(2);
    expect(flat.caveats.join(' ')).toMatch(/1 observed field below 1\.00 MG was left out/);
    expect(flat.overlay?.edges[0]).toBeCloseTo(0, 12);
    // Engine 2: all model fields in the disruption channel at 10^3.5 MG; the same list is then far off.
    const one = engineOne();
    const channel = one.bins.logField.edgesLog10MG.slice(0, 60).map((e) => (Math.abs(e - 3.5) < 1e-9 ? 1000 : 0));
    const two: EvaluableResult = { ...one, bins: { ...one.bins, logField: { ...one.bins.logField, byChannel: { disruption: channel, closeSurvivor: new Array(60).fill(0), fossil: new Array(60).fill(0) } } } };
    const split = evaluateConstraints(two, resolved({ kind: 'fieldDistribution', thresholdMG: 1, fieldsMG: fields }), SET).constraints[0];
    expect(split.sigma!).toBeGreaterThan(2);
  });
});

describe('evaluateConstraints: engine-2 observables', () => {
  const ageEdges = edges(-3, Math.log10(14), 30);
  const periodEdges = edges(-2, 4, 60);
  const two: EvaluableResult = {
    ...engineOne(),
    bins: {
      ...engineOne().bins,
      coolingAge: { edgesLog10Gyr: ageEdges, magnetic: new Array(30).fill(100), nonMagnetic: new Array(30).fill(900) },
      // All post-CE periods in the bin [0, 0.1) dex (1–1.26 d).
      postCommonEnvelopePeriod: { edgesLog10Days: periodEdges, magnetic: new Array(60).fill(0), nonMagnetic: periodEdges.slice(0, 60).map((e) => (Math.abs(e) < 1e-9 ? 5000 : 0)) },
    },
  };

  it('is unavailable on engine 1 and scored on engine 2 for cooling ages and periods', () => {
    const constraints = resolved(
      { kind: 'coolingAgeIncidence', bins: [{ ageMinGyr: 0, ageMaxGyr: 14, magnetic: 12, total: 100 }] },
      { kind: 'postCommonEnvelopePeriods', periodsDays: [0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9] },
    );
    const one = evaluateConstraints(engineOne(), constraints, SET);
    expect(one.constraints.map((c) => c.status)).toEqual(['unavailable', 'unavailable']);
    const e = evaluateConstraints(two, constraints, SET);
    expect(e.constraints.map((c) => c.status)).toEqual(['scored', 'scored']);
    // One bin covering every model bin: predicted 10%; Fisher's method of one test is that test (binom.test(12, 100, 0.1)).
    expect(e.constraints[0].p).toBeCloseTo(binomialTestTwoSided(12, 100, 0.1), 12);
    // All model periods at 1–1.26 d, all 8 observed below 1 d: D = 1 at the edge 1 d; Q_KS((√8 + 0.12 + 0.11/√8) · 1) ≈ 3e-8.
    expect(e.constraints[1].sigma!).toBeGreaterThan(5);
    expect(e.constraints[1].logLikelihood).toBeNull();
  });

  it("combines the scored constraints by Fisher's method and says that it treats them as independent", () => {
    const e = evaluateConstraints(
      two,
      resolved(
        { kind: 'fraction', setting: 'single', magnetic: 149, total: 1500 },
        { kind: 'coolingAgeIncidence', bins: [{ ageMinGyr: 0, ageMaxGyr: 1, magnetic: 3, total: 50 }, { ageMinGyr: 1, ageMaxGyr: 14, magnetic: 20, total: 100 }] },
        { kind: 'fraction', setting: 'all', value: 0.2, bound: 'lower' },
      ),
      SET,
    );
    expect(e.combined.scored).toBe(2);
    const expected = fisherCombination(e.constraints.slice(0, 2).map((c) => Math.log(c.p!)));
    expect(e.combined.p).toBeCloseTo(expected.pValue, 12);
    expect(e.combined.sigma).toBeCloseTo(sigmaFromTwoSidedP(expected.pValue), 8);
    expect(e.combined.method).toMatch(/independent/);
    expect(e.combined.logLikelihood).toBeCloseTo(e.constraints[0].logLikelihood! + e.constraints[1].logLikelihood!, 10);
  });
});

// Abramowitz & Stegun 1964 eq. 7.1.26 (|error| < 1.5e-7): enough for building test histograms.
function erf(x: number): number {
  const t = 1 / (1 + 0.3275911 * Math.abs(x));
  const y = 1 - ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t * Math.exp(-x * x);
  return x >= 0 ? y : -y;
}
// Bisection on the normal CDF above: quantiles to ~1e-7 for the test sample.
function inverseNormal(p: number): number {
  let lo = -8;
  let hi = 8;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (0.5 * (1 + erf(mid / Math.SQRT2)) < p) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
