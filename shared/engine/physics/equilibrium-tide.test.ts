import { describe, expect, it } from 'vitest';
import { LSUN_ERG_S, MSUN_G, RSUN_CM, YEAR_S } from '../constants.ts';
import { EngineError } from '../errors.ts';
import { eddyTurnoverTimeYr, equilibriumTideDecayRatePerYr } from './equilibrium-tide.ts';

// Zahn 1977 equilibrium tide as written by Villaver & Livio 2009 (ApJ 705, L81) and Mustill &
// Villaver 2012 (ApJ 761, 121): −(1/a) da/dt = (f/τ)(M_env/M) q(1+q)(R/a)^8,
// f = (9/2) min[1, (P/2τ)²], τ = [M_env R²/(3L)]^(1/3) (DESIGN's form; see equilibrium-tide.ts).

describe('eddy turnover time τ = [M_env R² / (3L)]^(1/3)', () => {
  it('is ≈ 0.49 yr for M_env = 0.5 Msun, R = 150 Rsun, L = 2500 Lsun (the formula evaluated in cgs here; 1e-12)', () => {
    const seconds = Math.cbrt((0.5 * MSUN_G * (150 * RSUN_CM) ** 2) / (3 * 2500 * LSUN_ERG_S));
    expect(eddyTurnoverTimeYr(0.5, 150, 2500) / (seconds / YEAR_S)).toBeCloseTo(1, 12);
    expect(seconds / YEAR_S).toBeCloseTo(0.49, 2);
  });
});

describe('equilibrium-tide decay rate', () => {
  const tau = 0.5;
  const menv = 0.5;
  const m = 1;
  const m2 = 0.001;
  const bare = (rOverA: number) => (menv / m) * (m2 / m) * (1 + m2 / m) * rOverA ** 8 / tau;

  it('uses the normalisation f = 9/2 when the period exceeds 2τ (the factor DESIGN and the papers print; without it the tide is 4.5× weaker)', () => {
    expect(equilibriumTideDecayRatePerYr(tau, menv, m, m2, 0.5, 1, 10 * tau) / bare(0.5)).toBeCloseTo(4.5, 12);
  });
  it('reduces f by (P/2τ)² for periods shorter than 2τ (P = τ → f = 4.5/4)', () => {
    expect(equilibriumTideDecayRatePerYr(tau, menv, m, m2, 0.5, 1, tau) / bare(0.5)).toBeCloseTo(4.5 / 4, 12);
  });
  it('falls as (R/a)^8: doubling the separation divides the saturated rate by 256', () => {
    const near = equilibriumTideDecayRatePerYr(tau, menv, m, m2, 0.4, 1, 10);
    const far = equilibriumTideDecayRatePerYr(tau, menv, m, m2, 0.4, 2, 10);
    expect(near / far).toBeCloseTo(256, 9);
  });
  it('gives the doc example 9 × 0.5 × 0.001 × 1.001 / 256 ≈ 1.76e-5 per yr (hand arithmetic)', () => {
    expect(equilibriumTideDecayRatePerYr(0.5, 0.5, 1, 0.001, 0.5, 1, 2) / ((9 * 0.5 * 0.001 * 1.001) / 256)).toBeCloseTo(1, 12);
  });
  it('rejects a star radius beyond the separation and a non-positive eddy time, naming the parameter', () => {
    expect(() => equilibriumTideDecayRatePerYr(tau, menv, m, m2, 2, 1, 1)).toThrow(/starRadiusAU = 2/);
    expect(() => equilibriumTideDecayRatePerYr(0, menv, m, m2, 0.5, 1, 1)).toThrow(EngineError);
    expect(() => eddyTurnoverTimeYr(-1, 100, 1000)).toThrow(/envelopeMassMsun = -1/);
  });
});
