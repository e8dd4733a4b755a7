import { describe, expect, it } from 'vitest';
import { accretionFieldMG, debrisAccretionRateMsunPerYr } from './field-accretion.ts';
import { fossilFieldMG } from './fossil-field.ts';
import { lognormalFieldMG } from './field-lognormal.ts';

describe('field prescriptions', () => {
  it('log-normal: 50 MG median, 0.5 dex, z = −1 gives 50 · 10^-0.5', () => {
    expect(lognormalFieldMG(50, 0.5, -1)).toBeCloseTo(50 / Math.sqrt(10), 10);
    expect(lognormalFieldMG(50, 0, 3)).toBeCloseTo(50, 12);
  });

  it('accretion: the worked example, recomputed here in cgs from the formulas of FKR 2002 and Shakura & Sunyaev 1973', () => {
    // Constants typed in independently (CODATA 2018 G, IAU nominal Msun and Rsun, from memory).
    const G = 6.674e-8;
    const Msun = 1.989e33;
    const Rsun = 6.957e10;
    const [m, r, md, rd, alpha, h] = [0.6, 0.01244, 9.546e-4, 2.15, 0.1, 0.1];
    const omega = Math.sqrt((G * m * Msun) / Math.pow(rd * Rsun, 3));
    const mdot = (md * Msun) / (1 / (alpha * h * h * omega)); // disc mass / viscous time
    // r_A = (μ⁴ / (2 G M Ṁ²))^(1/7) = R  ⇒  μ = (2 G M Ṁ² R⁷)^(1/4), B = μ / R³.
    const mu = Math.pow(2 * G * m * Msun * mdot * mdot * Math.pow(r * Rsun, 7), 0.25);
    const expectedMG = mu / Math.pow(r * Rsun, 3) / 1e6;
    // Constants differ in the 4th digit from the engine's (G 6.6743e-8, Msun from GM_sun), so 0.1%.
    expect(accretionFieldMG(m, r, md, rd, alpha, h) / expectedMG).toBeCloseTo(1, 3);
    // The module's worked example quotes Ω_K ≈ 1.54e-4 s^-1, Ṁ ≈ 4.6e-3 Msun/yr and B ≈ 13 MG (2 digits).
    expect(omega).toBeCloseTo(1.54e-4, 6);
    expect(debrisAccretionRateMsunPerYr(m, md, rd, alpha, h)).toBeCloseTo(4.6e-3, 4);
    expect(Math.abs(accretionFieldMG(m, r, md, rd, alpha, h) - 13)).toBeLessThan(1);
  });

  it('accretion: the magnetospheric radius computed from the returned field sits on the surface', () => {
    const G = 6.6743e-8;
    const Msun = 1.3271244e26 / 6.6743e-8;
    const Rsun = 6.957e10;
    const b = accretionFieldMG(0.8, 0.01, 0.01, 1.5, 0.01, 0.05) * 1e6;
    const mdot = (debrisAccretionRateMsunPerYr(0.8, 0.01, 1.5, 0.01, 0.05) * Msun) / (365.25 * 86400);
    const mu = b * Math.pow(0.01 * Rsun, 3);
    const rA = Math.pow(Math.pow(mu, 4) / (2 * G * 0.8 * Msun * mdot * mdot), 1 / 7);
    expect(rA / (0.01 * Rsun)).toBeCloseTo(1, 9);
  });

  it('fossil: flux conservation B_WD = B_MS (R_MS/R_WD)² (Wickramasinghe & Ferrario 2005)', () => {
    // 1 kG on a 1.95 Rsun star kept to a 0.0107 Rsun white dwarf: 1e-3 MG · (1.95/0.0107)² ≈ 33 MG.
    expect(fossilFieldMG(1, 1.95, 0.0107)).toBeCloseTo(1e-3 * (1.95 / 0.0107) ** 2, 10);
    expect(Math.abs(fossilFieldMG(1, 1.95, 0.0107) - 33)).toBeLessThan(0.5);
  });
});
