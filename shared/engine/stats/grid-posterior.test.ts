import { describe, expect, it } from 'vitest';
import { gridAxisValues, gridNodes, gridPosterior, type GridAxis } from './grid-posterior.ts';

const axis = (over: Partial<GridAxis>): GridAxis => ({ path: 'x', min: 0, max: 1, points: 11, scale: 'linear', prior: 'uniform', ...over });

describe('grid axes', () => {
  it('spaces a log grid evenly in ln x and ends exactly on the range', () => {
    const v = gridAxisValues(axis({ min: 1, max: 100, points: 3, scale: 'log' }));
    expect(v[0]).toBe(1);
    expect(v[1]).toBeCloseTo(10, 12);
    expect(v[2]).toBe(100);
  });
  it('lists the nodes row-major, the last parameter fastest', () => {
    expect(gridNodes([axis({ path: 'a', points: 2 }), axis({ path: 'b', points: 3 })])).toEqual([
      [0, 0], [0, 0.5], [0, 1], [1, 0], [1, 0.5], [1, 1],
    ]);
  });
  it('refuses a log grid that reaches zero, naming the field', () => {
    expect(() => gridAxisValues(axis({ path: 'envelope.alpha', min: 0, scale: 'log' }))).toThrow(/envelope\.alpha\.min/);
  });
});

describe('gridPosterior', () => {
  it('recovers μ ± σ and μ ± 1.96σ of a Gaussian likelihood under a flat prior', () => {
    // A Gaussian posterior's central 68.27% interval is μ ± σ and its 95% one μ ± 1.960σ (common
    // practice, no source). Grid step 0.01σ over ±8σ: the trapezoid and the linear-density
    // quantiles are accurate to O(h²) ≈ 1e-4 σ, so 1e-3 σ is a safe bound.
    const mu = 2;
    const sigma = 0.5;
    const ax = axis({ path: 'alpha', min: mu - 8 * sigma, max: mu + 8 * sigma, points: 1601 });
    const ll = gridAxisValues(ax).map((x) => -0.5 * ((x - mu) / sigma) ** 2);
    const post = gridPosterior([ax], ll);
    const [iv] = post.intervals;
    expect(iv.best).toBeCloseTo(mu, 9);
    expect(Math.abs(iv.lo68 - (mu - sigma))).toBeLessThan(1e-3 * sigma);
    expect(Math.abs(iv.hi68 - (mu + sigma))).toBeLessThan(1e-3 * sigma);
    expect(Math.abs(iv.lo95 - (mu - 1.959964 * sigma))).toBeLessThan(1e-3 * sigma);
    expect(Math.abs(iv.hi95 - (mu + 1.959964 * sigma))).toBeLessThan(1e-3 * sigma);
    // The peak density of a normal distribution is 1/(σ√(2π)).
    expect(Math.max(...post.marginals[0].density)).toBeCloseTo(1 / (sigma * Math.sqrt(2 * Math.PI)), 4);
    expect(post.warnings).toEqual([]);
  });

  it('a log-uniform prior on a log grid with a flat likelihood gives θ_q = a (b/a)^q, and says the likelihood is flat', () => {
    // Density ∝ 1/θ on [a, b]: CDF = ln(θ/a) / ln(b/a), so the quantile q is a (b/a)^q exactly.
    // 401 log-spaced nodes: the linear-in-θ density between nodes differs from 1/θ by O(h²); the
    // relative step is 1.2%, so quantiles agree within 1e-3 relative.
    const ax = axis({ path: 'companions.multiplier', min: 1, max: 100, points: 401, scale: 'log', prior: 'logUniform' });
    const post = gridPosterior([ax], new Array(401).fill(-3.2));
    const [iv] = post.intervals;
    const q = (p: number) => 100 ** p;
    expect(iv.lo68 / q(0.15865525)).toBeCloseTo(1, 3);
    expect(iv.hi68 / q(0.84134475)).toBeCloseTo(1, 3);
    expect(iv.lo95 / q(0.025)).toBeCloseTo(1, 3);
    expect(iv.hi95 / q(0.975)).toBeCloseTo(1, 3);
    expect(post.warnings.some((w) => w.includes('flat over the grid'))).toBe(true);
  });

  it('says so when the posterior piles up at a range edge', () => {
    // ln L rising all the way to the upper edge: the data prefer values beyond the range.
    const ax = axis({ path: 'envelope.alpha', min: 0.1, max: 1, points: 10 });
    const post = gridPosterior([ax], gridAxisValues(ax).map((x) => 5 * x));
    expect(post.warnings.join(' ')).toMatch(/envelope\.alpha is still \d+% of its peak at the upper edge of the range \(1\)/);
    expect(post.warnings.join(' ')).not.toMatch(/lower edge/);
  });

  it('flags the interval whose end the grid sets, names the parameter by its label, and leaves an interior one unflagged', () => {
    // ln L = 5x on [0.1, 1] under a flat prior: the posterior ∝ e^{5x} is at e^{-4.5} ≈ 1% of its peak
    // at the lower edge (below the 10% rule) and at its peak at the upper edge (exact arithmetic).
    const ax = axis({ path: 'envelope.alpha', label: 'α_CE', min: 0.1, max: 1, points: 10 });
    const [iv] = gridPosterior([ax], gridAxisValues(ax).map((x) => 5 * x)).intervals;
    expect(iv).toMatchObject({ lowerEdge: false, upperEdge: true, flat: false });
    expect(gridPosterior([ax], gridAxisValues(ax).map((x) => 5 * x)).warnings[0]).toMatch(/^The posterior of α_CE is still 100% of its peak at the upper edge/);
    // A Gaussian well inside the range (μ = 0.55, σ = 0.05, edges 9σ away): no flag.
    const inner = gridPosterior([axis({ min: 0.1, max: 1, points: 181 })], gridAxisValues(axis({ min: 0.1, max: 1, points: 181 })).map((x) => -0.5 * ((x - 0.55) / 0.05) ** 2));
    expect(inner.intervals[0]).toMatchObject({ lowerEdge: false, upperEdge: false, flat: false });
  });

  it('on a log grid judges the edges per unit ln θ: a Gaussian in ln θ 2.56σ inside the lower edge is not piled there', () => {
    // L = N(ln θ; ln 0.1, 0.9) on a log grid 0.01–2 with a log-uniform prior: the posterior per unit ln θ is
    // the Gaussian itself, exp(−½ (ln 10 / 0.9)²) = 3.8% of its peak at θ = 0.01 (below the 10% rule) and
    // exp(−½ (ln 20 / 0.9)²) ≈ 0.05% at θ = 2. Per unit θ (p/θ) the lower edge would read ≥ 38% and be flagged.
    const ax = axis({ path: 'envelope.alpha', min: 0.01, max: 2, points: 201, scale: 'log', prior: 'logUniform' });
    const ll = gridAxisValues(ax).map((x) => -0.5 * (Math.log(x / 0.1) / 0.9) ** 2);
    const post = gridPosterior([ax], ll);
    expect(post.intervals[0]).toMatchObject({ lowerEdge: false, upperEdge: false, flat: false });
    expect(post.warnings).toEqual([]);
    // Centred on the lower edge itself, half the ln θ-Gaussian lies beyond it: flagged, at 100% of the peak.
    const atEdge = gridPosterior([ax], gridAxisValues(ax).map((x) => -0.5 * (Math.log(x / 0.01) / 0.9) ** 2));
    expect(atEdge.intervals[0].lowerEdge).toBe(true);
    expect(atEdge.warnings[0]).toMatch(/still 100% of its peak at the lower edge of the range \(0\.01\)/);
  });

  it('at an edge that is the parameter’s own limit says "read it as an upper limit" instead of "widen the range"', () => {
    // Zero magnetic of 400 against a fraction proportional to the multiplier m, f = 0.1 m on m ∈ [0, 4]:
    // L = (1 − 0.1 m)^400 peaks at m = 0, which no multiplier can go below.
    const ax = axis({ path: 'companions.multiplier', label: 'Occurrence multiplier', min: 0, max: 4, points: 129, limits: { lower: true, upper: false } });
    const post = gridPosterior([ax], gridAxisValues(ax).map((m) => 400 * Math.log1p(-0.1 * m)));
    expect(post.intervals[0]).toMatchObject({ lowerEdge: false, lowerLimit: true, upperEdge: false, upperLimit: false });
    expect(post.warnings).toEqual([
      'The posterior of Occurrence multiplier is still 100% of its peak at 0, the lowest value it can take: the data favour that limit, so read the result as an upper limit on Occurrence multiplier; the central interval\'s lower end is not a measurement.',
    ]);
    // The same grid whose lower end is not a limit: cut by the grid.
    const cut = gridPosterior([{ ...ax, limits: undefined }], gridAxisValues(ax).map((m) => 400 * Math.log1p(-0.1 * m)));
    expect(cut.intervals[0]).toMatchObject({ lowerEdge: true, lowerLimit: false });
  });

  it('a flat likelihood marks the interval as the prior’s and does not also call it piled at the edges', () => {
    // Constant ln L under a uniform prior: the marginal is uniform, ≥ 10% of its peak at both edges,
    // but that is the prior, not the data: one flat warning, no edge warnings.
    const ax = axis({ path: 'giant.reachAU', label: 'Engulfment reach', min: 1, max: 4, points: 7 });
    const post = gridPosterior([ax], new Array(7).fill(-2));
    expect(post.intervals[0]).toMatchObject({ flat: true, lowerEdge: false, upperEdge: false, lowerLimit: false, upperLimit: false });
    expect(post.warnings).toHaveLength(1);
    expect(post.warnings[0]).toMatch(/^The likelihood is flat over the grid/);
  });

  it('marginalises a 2-D grid: an independent product likelihood gives each factor back, and a flat axis is named', () => {
    // L(a, b) = N(a; 0.3, 0.05) · const(b): the marginal of a is the 1-D Gaussian, b is unconstrained.
    const a = axis({ path: 'a', min: 0, max: 0.6, points: 121 });
    const b = axis({ path: 'b', min: 1, max: 2, points: 5 });
    const ll = gridNodes([a, b]).map(([x]) => -0.5 * ((x - 0.3) / 0.05) ** 2);
    const post = gridPosterior([a, b], ll);
    // Step 0.1σ: the linear-density quantiles are good to ~1e-3σ.
    expect(post.intervals[0].lo68).toBeCloseTo(0.25, 3);
    expect(post.intervals[0].hi68).toBeCloseTo(0.35, 3);
    expect(post.marginals[1].density.every((d) => Math.abs(d - 1) < 1e-12)).toBe(true);
    expect(post.warnings.join(' ')).toMatch(/flat along b/);
    expect(post.intervals.map((iv) => iv.flat)).toEqual([false, true]);
    expect(post.bestIndex).toBe(60 * 5);
  });

  it('counts nodes without a likelihood as zero likelihood and says how many', () => {
    const ax = axis({ points: 5 });
    const post = gridPosterior([ax], [null, -1, 0, -1, -4]);
    expect(post.marginals[0].density[0]).toBe(0);
    expect(post.warnings[0]).toMatch(/^1 of 5 grid nodes/);
  });
});
