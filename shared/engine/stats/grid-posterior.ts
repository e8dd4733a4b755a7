import { EngineError } from '../errors.ts';

/**
 * Posterior of 1–4 parameters on a rectangular grid, from the log-likelihood at every grid node and
 * a prior per parameter (Bayes' theorem, e.g. Sivia & Skilling 2006, "Data Analysis: A Bayesian
 * Tutorial", ch. 2–3).
 *
 * - The density is p(θ) ∝ L(θ) π(θ), with π uniform in θ or log-uniform (∝ 1/θ, "Jeffreys" prior
 *   for a scale parameter).
 * - Marginals integrate the other parameters with the trapezoidal rule on their grid (linear or log
 *   spaced), so the marginal density is per unit of the parameter itself and integrates to 1.
 * - Intervals are central (equal-tailed) credible intervals: 15.865–84.135% (68.27%) and
 *   2.5–97.5% (95%) of the marginal, with the density taken linear between grid nodes (the CDF
 *   quadratic in each cell, inverted exactly). `best` is the marginal's highest grid node.
 * - Warnings say when a marginal is still above 10% of its peak at a range edge (the interval is cut
 *   by the range; on a log grid, the density per unit ln θ) and when the likelihood is flat (varies by less than ½ in ln L, i.e. less than a
 *   1σ change for one Gaussian parameter) over the grid or along one parameter. Each interval
 *   carries the same findings as flags (`lowerEdge`, `upperEdge`, `flat`), so that a sentence
 *   quoting it can say that its ends are the grid's, or that it is the prior's.
 *
 * Example: a flat likelihood with a log-uniform prior on [1, 100] gives the quantiles
 * θ_q = 1 · 100^q, so the 68% interval is [100^0.15865, 100^0.84135] = [2.08, 48.0].
 */

export type GridScale = 'linear' | 'log';
export type GridPrior = 'uniform' | 'logUniform';

export interface GridAxis {
  path: string;
  /** The parameter's name in warnings (default: its path). */
  label?: string;
  /** The range's lower (upper) end is the parameter's own limit (e.g. a multiplier of 0): nothing lies beyond it, so a posterior piled there is bounded by the parameter, not cut by the grid. */
  limits?: { lower: boolean; upper: boolean };
  min: number;
  max: number;
  points: number;
  scale: GridScale;
  prior: GridPrior;
}

export interface GridPosterior {
  parameters: { path: string; values: number[]; scale: GridScale; prior: GridPrior }[];
  /** ln L at every node, row-major (the last parameter varies fastest); null where it could not be computed. */
  logLikelihood: (number | null)[];
  /** ln of the normalised posterior density at every node (null where L is 0 or unknown). */
  logPosterior: (number | null)[];
  marginals: { path: string; values: number[]; density: number[] }[];
  intervals: GridInterval[];
  /** Row-major index of the node of highest likelihood. */
  bestIndex: number;
  warnings: string[];
}

export interface GridInterval {
  path: string;
  best: number;
  lo68: number;
  hi68: number;
  lo95: number;
  hi95: number;
  /** The marginal is still ≥ 10% of its peak at the range's lower (upper) edge: the interval is cut there by the grid, not by the data. */
  lowerEdge: boolean;
  upperEdge: boolean;
  /** The same, at an edge that is the parameter's own limit: the posterior piles at the limit, so the result is in effect one-sided. */
  lowerLimit: boolean;
  upperLimit: boolean;
  /** The likelihood does not vary along this parameter (by < ½ in ln L): its marginal is its prior. */
  flat: boolean;
}

/** Probability outside a central 68.27% interval on each side: (1 − erf(1/√2)) / 2. */
const TAIL_68 = 0.15865525393145707;
const TAIL_95 = 0.025;
/** A marginal still this fraction of its peak at a range edge is "piled at the edge". */
const EDGE_FRACTION = 0.1;
/** ln L varying by less than this over the grid: the likelihood is flat. */
const FLAT_DELTA_LN_L = 0.5;

/** The grid values of one axis: `points` values from min to max, evenly spaced in x or in ln x. */
export function gridAxisValues(axis: Pick<GridAxis, 'path' | 'min' | 'max' | 'points' | 'scale'>): number[] {
  const { min, max, points, scale } = axis;
  if (!(Number.isInteger(points) && points >= 2)) throw new EngineError(`${axis.path}.points`, points, 'integers ≥ 2');
  if (!(max > min)) throw new EngineError(`${axis.path}.max`, max, `numbers above min (${min})`);
  if (scale === 'log' && !(min > 0)) throw new EngineError(`${axis.path}.min`, min, 'numbers above 0 for a log grid');
  return Array.from({ length: points }, (_, i) => {
    if (i === points - 1) return max;
    if (scale === 'linear') return min + ((max - min) * i) / (points - 1);
    return Math.exp(Math.log(min) + ((Math.log(max) - Math.log(min)) * i) / (points - 1));
  });
}

/** Every node of the grid as a list of values, row-major (the last axis varies fastest). */
export function gridNodes(axes: readonly GridAxis[]): number[][] {
  return axes.map(gridAxisValues).reduce<number[][]>((nodes, values) => nodes.flatMap((n) => values.map((v) => [...n, v])), [[]]);
}

/** Trapezoidal weights of a sorted grid: ∫ f dx ≈ Σ w_i f(x_i). */
function trapezoidWeights(x: number[]): number[] {
  return x.map((_, i) => ((i + 1 < x.length ? x[i + 1] : x[i]) - (i > 0 ? x[i - 1] : x[i])) / 2);
}

/** The x at which the piecewise-linear density's integral from x[0] reaches `target`. */
function quantile(x: number[], density: number[], target: number): number {
  let cumulative = 0;
  for (let i = 0; i + 1 < x.length; i++) {
    const h = x[i + 1] - x[i];
    const f0 = density[i];
    const f1 = density[i + 1];
    const cell = ((f0 + f1) * h) / 2;
    if (cumulative + cell >= target && cell > 0) {
      const need = target - cumulative;
      // f0 t + (f1 − f0) t² / (2h) = need, for t in [0, h].
      const a = (f1 - f0) / (2 * h);
      const t = Math.abs(a) < 1e-300 ? need / f0 : (-f0 + Math.sqrt(Math.max(0, f0 * f0 + 4 * a * need))) / (2 * a);
      return x[i] + Math.min(h, Math.max(0, t));
    }
    cumulative += cell;
  }
  return x[x.length - 1];
}

const fmt = (x: number) => (Math.abs(x) >= 1e4 || (Math.abs(x) < 1e-3 && x !== 0) ? x.toExponential(2) : Number(x.toPrecision(3)).toString());

export function gridPosterior(axes: readonly GridAxis[], logLikelihood: readonly (number | null)[]): GridPosterior {
  if (axes.length < 1 || axes.length > 4) throw new EngineError('parameters', axes.length, '1 to 4 parameters');
  axes.forEach((a, i) => {
    if (a.prior === 'logUniform' && !(a.min > 0)) throw new EngineError(`parameters[${i}].min`, a.min, 'numbers above 0 for a log-uniform prior');
  });
  const values = axes.map(gridAxisValues);
  const sizes = values.map((v) => v.length);
  const total = sizes.reduce((a, b) => a * b, 1);
  if (logLikelihood.length !== total) throw new EngineError('logLikelihood', logLikelihood.length, `${total} entries (one per grid node)`);
  const strides = sizes.map((_, i) => sizes.slice(i + 1).reduce((a, b) => a * b, 1));
  const indexOf = (node: number, axis: number) => Math.floor(node / strides[axis]) % sizes[axis];
  const weights = values.map(trapezoidWeights);
  const logPrior = values.map((v, i) => v.map((x) => (axes[i].prior === 'logUniform' ? -Math.log(x) : 0)));

  const finiteLl = logLikelihood.filter((x): x is number => x !== null && Number.isFinite(x));
  const warnings: string[] = [];
  const missing = total - finiteLl.length;
  if (finiteLl.length === 0) throw new EngineError('logLikelihood', 'none finite', 'at least one grid node with a finite log-likelihood');
  if (missing > 0) warnings.push(`${missing} of ${total} grid nodes have no finite likelihood (a constraint could not be scored or the prediction is impossible there); they count as zero likelihood.`);

  // Unnormalised log posterior at each node, shifted by its maximum so that exp() cannot overflow.
  const logPost = logLikelihood.map((ll, node) => {
    if (ll === null || !Number.isFinite(ll)) return -Infinity;
    let lp = ll;
    for (let a = 0; a < axes.length; a++) lp += logPrior[a][indexOf(node, a)];
    return lp;
  });
  const peak = Math.max(...logPost);
  const post = logPost.map((lp) => Math.exp(lp - peak));

  let bestIndex = 0;
  for (let node = 1; node < total; node++) if ((logLikelihood[node] ?? -Infinity) > (logLikelihood[bestIndex] ?? -Infinity)) bestIndex = node;

  // Normalisation: ∫ p dθ over the whole grid (product of trapezoid weights).
  let evidence = 0;
  const cellWeight = (node: number, skip: number) => {
    let w = 1;
    for (let a = 0; a < axes.length; a++) if (a !== skip) w *= weights[a][indexOf(node, a)];
    return w;
  };
  for (let node = 0; node < total; node++) evidence += post[node] * cellWeight(node, -1);

  const marginals = axes.map((axis, a) => {
    const density = new Array<number>(sizes[a]).fill(0);
    for (let node = 0; node < total; node++) density[indexOf(node, a)] += post[node] * cellWeight(node, a);
    const norm = density.reduce((s, d, i) => s + d * weights[a][i], 0);
    return { path: axis.path, values: values[a], density: density.map((d) => (norm > 0 ? d / norm : 0)) };
  });

  // Flat likelihood over the whole grid, or along one parameter (its profile: the best ln L at each of its values).
  const spread = Math.max(...finiteLl) - Math.min(...finiteLl);
  const flatEverywhere = spread < FLAT_DELTA_LN_L;
  const flat = axes.map((_, a) => {
    if (flatEverywhere || axes.length === 1) return flatEverywhere;
    const profile = new Array<number>(sizes[a]).fill(-Infinity);
    logLikelihood.forEach((ll, node) => {
      if (ll !== null && Number.isFinite(ll)) profile[indexOf(node, a)] = Math.max(profile[indexOf(node, a)], ll);
    });
    const finite = profile.filter(Number.isFinite);
    return finite.length > 0 && Math.max(...finite) - Math.min(...finite) < FLAT_DELTA_LN_L;
  });

  const intervals = marginals.map((m, a): GridInterval => {
    const x = m.values;
    const d = m.density;
    const name = axes[a].label ?? m.path;
    const peakAt = d.reduce((best, v, i) => (v > d[best] ? i : best), 0);
    // The edge test reads the density per unit of the grid's own coordinate: θ p(θ) per unit ln θ on a
    // log grid. Per unit θ, the lower edge of a wide log grid looks crowded even when it holds little
    // probability (and the upper edge the reverse).
    const e = axes[a].scale === 'log' ? d.map((v, i) => v * x[i]) : d;
    const top = Math.max(...e);
    const limits = axes[a].limits ?? { lower: false, upper: false };
    const piledLow = top > 0 && e[0] >= EDGE_FRACTION * top && !flat[a];
    const piledHigh = top > 0 && e[x.length - 1] >= EDGE_FRACTION * top && !flat[a];
    // A flat axis is named once as flat; its marginal is the prior, so its edges say nothing about the data.
    if (piledLow) {
      warnings.push(
        limits.lower
          ? `The posterior of ${name} is still ${Math.round((100 * e[0]) / top)}% of its peak at ${fmt(axes[a].min)}, the lowest value it can take: the data favour that limit, so read the result as an upper limit on ${name}; the central interval's lower end is not a measurement.`
          : `The posterior of ${name} is still ${Math.round((100 * e[0]) / top)}% of its peak at the lower edge of the range (${fmt(axes[a].min)}): the data allow lower values, so widen the range; the intervals are cut by it.`,
      );
    }
    if (piledHigh) {
      warnings.push(
        limits.upper
          ? `The posterior of ${name} is still ${Math.round((100 * e[x.length - 1]) / top)}% of its peak at ${fmt(axes[a].max)}, the highest value it can take: the data favour that limit, so read the result as a lower limit on ${name}; the central interval's upper end is not a measurement.`
          : `The posterior of ${name} is still ${Math.round((100 * e[x.length - 1]) / top)}% of its peak at the upper edge of the range (${fmt(axes[a].max)}): the data allow higher values, so widen the range; the intervals are cut by it.`,
      );
    }
    return {
      path: m.path,
      best: x[peakAt],
      lo68: quantile(x, d, TAIL_68),
      hi68: quantile(x, d, 1 - TAIL_68),
      lo95: quantile(x, d, TAIL_95),
      hi95: quantile(x, d, 1 - TAIL_95),
      lowerEdge: piledLow && !limits.lower,
      upperEdge: piledHigh && !limits.upper,
      lowerLimit: piledLow && limits.lower,
      upperLimit: piledHigh && limits.upper,
      flat: flat[a],
    };
  });

  if (flatEverywhere) {
    warnings.push(`The likelihood is flat over the grid (ln L varies by ${fmt(spread)} < ${FLAT_DELTA_LN_L}): the constraints do not tell these parameter values apart, so the posterior is the prior.`);
  } else {
    axes.forEach((axis, a) => {
      if (flat[a]) warnings.push(`The likelihood is flat along ${axis.label ?? axis.path} (its profile varies by less than ${FLAT_DELTA_LN_L} in ln L): the constraints do not constrain it, so its marginal is its prior.`);
    });
  }

  return {
    parameters: axes.map((a, i) => ({ path: a.path, values: values[i], scale: a.scale, prior: a.prior })),
    logLikelihood: [...logLikelihood],
    logPosterior: post.map((p) => (p > 0 ? Math.log(p / evidence) : null)),
    marginals,
    intervals,
    bestIndex,
    warnings,
  };
}
