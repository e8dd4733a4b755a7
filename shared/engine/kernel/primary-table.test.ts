import { describe, expect, it } from 'vitest';
import type { ImfOptions } from '../../contracts/scenario.ts';
import { buildImfSampler } from '../physics/imf-sampler.ts';
import { chunkUniform } from '../random.ts';
import { buildPrimaryTable, buildWhiteDwarfDraw, PRIMARY_STRIDE, whiteDwarfPosition } from './primary-table.ts';
import type { PreparedLifetime } from './scenario-physics.ts';

// Independent references: the closed-form power-law IMF (Salpeter 1955, dN/dM ∝ M^-2.35) and the
// scaling lifetime t_MS = 10 Gyr (M/Msun)^-2.5 (a textbook approximation, common practice, no
// source), integrated here by the trapezoid rule on a fine grid; nothing below calls the engine's
// IMF or lifetime code except through the table under test.
const LO = 0.8;
const HI = 8;
const SLOPE = 2.35;
const salpeter: ImfOptions = { law: 'salpeter1955' };
const scaling: PreparedLifetime = { kind: 'scaling', t0Gyr: 10, exponent: 2.5 };
const lifetimeOf = (m: number) => 10 * m ** -2.5;
const cdfOf = (m: number) => (LO ** (1 - SLOPE) - m ** (1 - SLOPE)) / (LO ** (1 - SLOPE) - HI ** (1 - SLOPE));
const quantileOf = (u: number) => (LO ** (1 - SLOPE) - u * (LO ** (1 - SLOPE) - HI ** (1 - SLOPE))) ** (1 / (1 - SLOPE));

/** ∫ f(M) dF(M) over [a, b] by the trapezoid rule in u (dF = du), n steps. */
function integrateOverU(f: (m: number) => number, a: number, b: number, n = 200_000): number {
  const ua = cdfOf(a);
  const ub = cdfOf(b);
  let sum = 0;
  for (let i = 0; i <= n; i++) {
    const w = i === 0 || i === n ? 0.5 : 1;
    sum += w * f(quantileOf(ua + ((ub - ua) * i) / n));
  }
  return (sum * (ub - ua)) / n;
}

const table = buildPrimaryTable(buildImfSampler(salpeter, [LO, HI]), scaling);
const read = (u: number) => {
  const position = u * table.cells;
  const k = Math.min(position | 0, table.cells - 1);
  const w = position - k;
  const at = PRIMARY_STRIDE * k;
  return {
    mass: table.nodes[at] + w * (table.nodes[at + PRIMARY_STRIDE] - table.nodes[at]),
    lifetime: table.nodes[at + 1] + w * (table.nodes[at + PRIMARY_STRIDE + 1] - table.nodes[at + 1]),
    log10MassFloor: table.nodes[at + 2],
  };
};

describe('primary table (mass and lifetime over the mass uniform)', () => {
  it('reads off masses within 2e-7 in probability of the closed-form quantile, lifetimes of the mass read', () => {
    const u = chunkUniform('primary-table', 0);
    for (let i = 0; i < 20_000; i++) {
      const v = u();
      const { mass, lifetime, log10MassFloor } = read(v);
      // 1e-7 for the primary table over the IMF sampler's own table (1e-7): 2e-7 in all.
      expect(Math.abs(cdfOf(mass) - v)).toBeLessThanOrEqual(2e-7);
      // The lifetime column is the lifetime at a uniform within 1e-7 of the mass column's.
      expect(Math.abs(cdfOf((lifetime / 10) ** (-1 / 2.5)) - cdfOf(mass))).toBeLessThanOrEqual(2e-7);
      expect(log10MassFloor).toBeLessThanOrEqual(Math.log10(mass));
    }
  });
});

describe('white dwarfs drawn directly', () => {
  it('burst: the white-dwarf share is the IMF share above the turn-off mass', () => {
    // 3 Gyr burst: turn-off where 10 M^-2.5 = 3, M = (10/3)^0.4 ≈ 1.619 Msun.
    const draw = buildWhiteDwarfDraw(table, { constant: false, ageGyr: 3 });
    expect(Math.abs(draw.probability - (1 - cdfOf((10 / 3) ** 0.4)))).toBeLessThanOrEqual(3e-7);
  });

  it('constant star formation: the share is (1/A) ∫ (A − t_MS)⁺ dF, and the masses drawn follow that weighting', () => {
    const A = 10;
    const draw = buildWhiteDwarfDraw(table, { constant: true, ageGyr: A });
    const turnOff = 1; // 10 M^-2.5 = 10 at M = 1
    const expected = integrateOverU((m) => A - lifetimeOf(m), turnOff, HI) / A;
    expect(Math.abs(draw.probability - expected)).toBeLessThanOrEqual(1e-6);

    // Kolmogorov–Smirnov distance of 100,000 drawn masses from the exact conditional CDF
    // G(M) = ∫_{1}^{M} (A − t) dF / ∫_{1}^{8} (A − t) dF, tabulated by the trapezoid rule.
    const grid = Array.from({ length: 2001 }, (_, i) => turnOff * (HI / turnOff) ** (i / 2000));
    const partial = grid.map((m) => integrateOverU((x) => A - lifetimeOf(x), turnOff, m, 2000) / (A * expected));
    const conditionalCdf = (m: number) => {
      const i = Math.min(grid.length - 2, Math.max(0, Math.floor((2000 * Math.log(m / turnOff)) / Math.log(HI / turnOff))));
      const w = (m - grid[i]) / (grid[i + 1] - grid[i]);
      return partial[i] + w * (partial[i + 1] - partial[i]);
    };
    const u = chunkUniform('white-dwarf-draw', 0);
    const out = new Float64Array(1);
    const masses: number[] = [];
    for (let i = 0; i < 100_000; i++) {
      whiteDwarfPosition(draw, table, u, out, 0);
      const v = out[0] / table.cells;
      const { mass, lifetime } = read(v);
      expect(lifetime).toBeLessThanOrEqual(A * (1 + 1e-12));
      masses.push(mass);
    }
    masses.sort((a, b) => a - b);
    let distance = 0;
    masses.forEach((m, i) => {
      const g = conditionalCdf(m);
      distance = Math.max(distance, Math.abs(g - i / masses.length), Math.abs(g - (i + 1) / masses.length));
    });
    // 1% critical value of the KS distance for n = 1e5: 1.63 / √n ≈ 0.0052 (Smirnov 1948, asymptotic).
    expect(distance).toBeLessThan(0.0052);
  });

  it('no white dwarfs while the age is below every lifetime; all of them when every lifetime is below it', () => {
    expect(buildWhiteDwarfDraw(table, { constant: false, ageGyr: 0.01 }).probability).toBe(0);
    expect(buildWhiteDwarfDraw(table, { constant: false, ageGyr: 20 }).probability).toBe(1);
  });
});
