import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
// @ts-ignore -- jstat (dev dependency, the reference library) ships no type declarations
import jstat from 'jstat';
import { parseScenario, type Scenario } from '../../contracts/scenario.ts';
import { buildResult } from '../result/build-result.ts';
import { prepareScenario } from './prepare.ts';
import { runChunk } from './run-chunk.ts';
import { addTally, emptyTallyFor } from './tally.ts';

/**
 * Independent check of the kernel: the magnetic fraction that follows from the scenario
 * semantics, by numerical quadrature written here from the published formulas (none of the
 * engine's physics helpers is called), against the Monte Carlo result, |MC − quadrature| < 3 SE.
 */

const { jStat } = jstat as { jStat: { normal: { cdf(x: number, m: number, s: number): number } } };
const Phi = (x: number) => jStat.normal.cdf(x, 0, 1);

// Constants typed in here (IAU 2015 nominal values; Gaussian constant of IAU 1976).
const K_GAUSS = 0.01720209895;
const RSUN_PER_AU = 1.495978707e13 / 6.957e10;
const RJUP_RSUN = 7.1492e9 / 6.957e10;
const MJUP_MSUN = 1 / 1047.3486;

/** Initial period (days) of a circular orbit of semi-major axis a (AU) around total mass M (Msun). */
const periodAt = (aAU: number, mTot: number) => ((2 * Math.PI) / K_GAUSS) * Math.sqrt((aAU * aAU * aAU) / mTot);
/** Nauenberg (1972) zero-temperature mass–radius fit with M_Ch = 1.44. */
const wdRadius = (m: number) => 0.0112 * Math.sqrt(Math.pow(m / 1.44, -2 / 3) - Math.pow(m / 1.44, 2 / 3));
/** Eggleton (1983). */
const roche = (q: number) => (0.49 * Math.pow(q, 2 / 3)) / (0.6 * Math.pow(q, 2 / 3) + Math.log(1 + Math.cbrt(q)));
/** 1 RJup below 0.08 Msun, Demircan & Kahraman (1991) above. */
const companionRadius = (m: number) => (m < 0.08 ? RJUP_RSUN : m < 1.66 ? 1.06 * Math.pow(m, 0.945) : 1.33 * Math.pow(m, 0.555));

/** Composite Simpson weights and nodes on [a, b] with n (even) intervals. */
function simpson(a: number, b: number, n: number): { x: number[]; w: number[] } {
  const h = (b - a) / n;
  const x: number[] = [];
  const w: number[] = [];
  for (let i = 0; i <= n; i++) {
    x.push(a + i * h);
    w.push(((i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * h) / 3);
  }
  return { x, w };
}

interface RowSpec {
  occurrence: number;
  /** Companion mass (Msun) at a point of the row's mass coordinate, and the coordinate's quadrature. */
  massAt: (x: number, m1: number) => number;
  massNodes: { x: number[]; w: number[] };
  /** Fraction of the row's periods below P (days). */
  periodCdf: (p: number) => number;
}

interface FateProbabilities {
  postCE: number;
  /** Destroyed in the envelope (engine 2: always the disruption channel; dissolution off). */
  destroyed: number;
}

/** Fate probabilities of one row's companion around a primary M1 (white dwarf mass mwd). */
function rowFates(row: RowSpec, m1: number, mwd: number, s: Scenario): FateProbabilities {
  const reach = (s.giant as { reachAU: number }).reachAU;
  const alphaLambda = s.envelope.alpha * s.envelope.lambda;
  const rCore = wdRadius(mwd);
  let post = 0;
  let destroyed = 0;
  const { x, w } = row.massNodes;
  for (let i = 0; i < x.length; i++) {
    const m2 = row.massAt(x[i], m1);
    const total = m1 + m2;
    // Webbink: a_f = a0 (Mc/M1) / (1 + 2 M_env/(α λ M2)) with R = a0 (the fixedReach assumption).
    const shrink = mwd / m1 / (1 + (2 * (m1 - mwd)) / (alphaLambda * m2));
    const r2 = companionRadius(m2);
    const survivalA0 = Math.max(rCore, r2 / roche(m2 / mwd)) / shrink / RSUN_PER_AU; // a0 above this survives the CE
    const fReach = row.periodCdf(periodAt(reach, total));
    const fDestroyed = row.periodCdf(periodAt(Math.min(survivalA0, reach), total));
    post += w[i] * (fReach - fDestroyed);
    destroyed += w[i] * fDestroyed;
  }
  return { postCE: post, destroyed };
}

/** P(z ≥ z_c): the log-normal field of channel c clears the threshold. */
function clearsThreshold(median: number, width: number, threshold: number): number {
  if (width === 0) return median >= threshold ? 1 : 0;
  return 1 - Phi(Math.log10(threshold / median) / width);
}

/**
 * Magnetic fraction and post-CE share among white dwarfs by quadrature over M1 (in ln M1), each
 * row's mass coordinate, and the shared standard-normal field deviate z (split where a channel's
 * field crosses the threshold, so each region is exact).
 */
function quadrature(
  s: Scenario,
  rows: RowSpec[],
  imfPerLnM: (m: number) => number,
  ifmr: (m: number) => number,
  whiteDwarfProbability: (m: number) => number,
  fossilProbability: (m1: number, mwd: number) => number,
) {
  const [lo, hi] = s.primaries.massRangeMsun;
  const f = s.field as { disruption: { medianMG: number; widthDex: number }; thresholdMG: number };
  const zc = [f.disruption].map((c) => (c.widthDex === 0 ? (c.medianMG >= f.thresholdMG ? -Infinity : Infinity) : Math.log10(f.thresholdMG / c.medianMG) / c.widthDex));
  const cuts = [-Infinity, ...zc.filter(Number.isFinite).sort((a, b) => a - b), Infinity];
  const m = s.companions.multiplier;
  const { x, w } = simpson(Math.log(lo), Math.log(hi), 400);
  let norm = 0;
  let magnetic = 0;
  let postCE = 0;
  for (let i = 0; i < x.length; i++) {
    const m1 = Math.exp(x[i]);
    const weight = w[i] * imfPerLnM(m1) * whiteDwarfProbability(m1);
    if (weight === 0) continue;
    const mwd = ifmr(m1);
    const fates = rows.map((r) => rowFates(r, m1, mwd, s));
    let pMagCompanion = 0;
    for (let k = 0; k + 1 < cuts.length; k++) {
      const zMid = Number.isFinite(cuts[k]) ? (Number.isFinite(cuts[k + 1]) ? 0.5 * (cuts[k] + cuts[k + 1]) : cuts[k] + 1) : cuts[k + 1] - 1;
      const mass = Phi(cuts[k + 1]) - Phi(cuts[k]);
      let none = 1;
      rows.forEach((r, j) => {
        const p = zMid >= zc[0] ? fates[j].destroyed : 0;
        none *= 1 - r.occurrence * m * p;
      });
      pMagCompanion += mass * (1 - none);
    }
    const pFossil = fossilProbability(m1, mwd);
    norm += weight;
    magnetic += weight * (1 - (1 - pFossil) * (1 - pMagCompanion));
    postCE += weight * (1 - rows.reduce((prod, r, j) => prod * (1 - r.occurrence * m * fates[j].postCE), 1));
  }
  return { magnetic: magnetic / norm, postCE: postCE / norm };
}

function runInProcess(s: Scenario) {
  const prepared = prepareScenario(s);
  let tally = emptyTallyFor(prepared.scenarioHash);
  for (let i = 0; i < prepared.chunkCount; i++) tally = addTally(tally, runChunk(prepared, i));
  return buildResult(s, tally, { prepared });
}

const logUniformRow = (lo: number, hi: number, slope: number, n = 200) => {
  // dN ∝ x^slope dln x on [lo, hi], as Simpson weights in ln x normalised to 1.
  const nodes = simpson(Math.log(lo), Math.log(hi), n);
  const w = nodes.w.map((wi, i) => wi * Math.exp(slope * nodes.x[i]));
  const sum = w.reduce((a, b) => a + b, 0);
  return { x: nodes.x, w: w.map((v) => v / sum) };
};
const powerLawCdf = (lo: number, hi: number, b: number) => (p: number) => {
  const c = Math.min(hi, Math.max(lo, p));
  return b === 0 ? Math.log(c / lo) / Math.log(hi / lo) : (Math.pow(c, b) - Math.pow(lo, b)) / (Math.pow(hi, b) - Math.pow(lo, b));
};

describe('kernel against direct integration of the scenario semantics', { timeout: 60_000 }, () => {
  it('the issue example (check-1): burst, Salpeter-slope power law, one planet row, fixedReach 2 AU', () => {
    const s = parseScenario(JSON.parse(readFileSync(new URL('../../../tests/fixtures/check-1.json', import.meta.url), 'utf8')));
    const row = s.companions.rows![0];
    const planets: RowSpec = {
      occurrence: row.occurrence,
      massAt: (lnM) => Math.exp(lnM) * MJUP_MSUN,
      massNodes: logUniformRow(0.5, 3, 0),
      periodCdf: powerLawCdf(10, 20000, 0),
    };
    const expected = quadrature(
      s,
      [planets],
      (m) => Math.pow(m, 1 - 2.35), // dN/dlnM = M dN/dM ∝ M^(1 − 2.35)
      (m) => 0.109 * m + 0.394, // Kalirai et al. 2008
      (m) => (10 * Math.pow(m, -2.5) < 10 ? 1 : 0), // burst: a white dwarf iff t_MS < 10 Gyr
      () => 0,
    );
    const result = runInProcess(s);
    const { value, se } = result.fraction;
    expect(result.counts.whiteDwarfs).toBe(1_000_000); // t_MS(1.2 Msun) = 6.3 Gyr < 10 Gyr: every primary
    expect(Math.abs(value! - expected.magnetic)).toBeLessThan(3 * se!);
    expect(result.counts.bySetting.postCE.whiteDwarfs).toBe(0); // planets never fit their Roche lobe after a CE
    expect(expected.postCE).toBe(0);
  }, 60_000);

  it('held-out fixed-reach check: α_CE = 0.05, log-normal fields far above the threshold, dissolution off', () => {
    // The fixed-reach semantics (final core, full envelope at R = a0) are unchanged by engine 2:
    // with α_CE = 0.05 almost every engulfed planet is destroyed, and with fields of 1000 MG ± 0.1
    // dex every destroyed planet makes the white dwarf magnetic.
    const base = JSON.parse(readFileSync(new URL('../../../tests/fixtures/check-1.json', import.meta.url), 'utf8'));
    const s = parseScenario({
      ...base,
      seed: 'held-out',
      systems: 500_000,
      envelope: { alpha: 0.05, lambda: 0.5 },
      disruption: { eta: 2.44, dissolution: { kind: 'none' } },
      field: { disruption: { kind: 'lognormal', medianMG: 1000, widthDex: 0.1 }, thresholdMG: 1 },
    });
    const row = s.companions.rows![0];
    const planets: RowSpec = {
      occurrence: row.occurrence,
      massAt: (lnM) => Math.exp(lnM) * MJUP_MSUN,
      massNodes: logUniformRow(0.5, 3, 0),
      periodCdf: powerLawCdf(10, 20000, 0),
    };
    const expected = quadrature(s, [planets], (m) => Math.pow(m, 1 - 2.35), (m) => 0.109 * m + 0.394, (m) => (10 * Math.pow(m, -2.5) < 10 ? 1 : 0), () => 0);
    const result = runInProcess(s);
    const { value, se } = result.fraction;
    expect(expected.magnetic).toBeGreaterThan(0.05); // not vacuous
    expect(Math.abs(value! - expected.magnetic)).toBeLessThan(3 * se!);
    expect(result.counts.companionFates.dissolved).toBe(0);
  }, 60_000);

  it('constant star formation, Kroupa IMF, planets + stellar companions (log-normal periods, flat q) + fossil fields', () => {
    const s = parseScenario({
      seed: 'direct-2',
      systems: 1_500_000,
      primaries: {
        imf: { law: 'kroupa2001' },
        massRangeMsun: [0.8, 8],
        history: { kind: 'constant', ageGyr: 10 },
        lifetime: { kind: 'scaling', t0Gyr: 10, exponent: 2.5 },
        ifmr: { relation: 'cummings2018', calibration: 'mist' },
      },
      companions: {
        multiplier: 1.5,
        rows: [
          { class: 'planet', massMJup: [0.3, 10], periodDays: [2, 2000], occurrence: 0.1, shape: { kind: 'powerlaw', massSlope: -0.31, periodSlope: 0.26 } },
          { class: 'star', massRatio: [0.05, 0.5], periodDays: [1, 1e8], occurrence: 0.3, shape: { kind: 'lognormalPeriod', meanLog10PeriodDays: 5.03, sigmaLog10Period: 2.28 } },
        ],
      },
      giant: { kind: 'fixedReach', reachAU: 3 },
      envelope: { alpha: 1, lambda: 0.5 },
      disruption: { eta: 1 },
      field: {
        disruption: { kind: 'lognormal', medianMG: 3, widthDex: 1 },
        thresholdMG: 1,
      },
      channels: { disruption: true, fossil: { enabled: true, fraction: 0.2, massRangeMsun: [2, 4], msField: { medianKG: 0.01, widthDex: 0.5 } } },
    });
    const cummingsMist = (m: number) => (m < 2.85 ? 0.08 * m + 0.489 : m < 3.6 ? 0.187 * m + 0.184 : 0.107 * m + 0.471);
    const [mean, sigma] = [5.03, 2.28];
    const lnCdf = (p: number) => Phi((Math.log10(p) - mean) / sigma);
    const stars: RowSpec = {
      occurrence: 0.3,
      massAt: (q, m1) => q * m1,
      massNodes: (() => {
        const n = simpson(0.05, 0.5, 200);
        return { x: n.x, w: n.w.map((v) => v / 0.45) };
      })(),
      periodCdf: (p) => (lnCdf(Math.min(1e8, Math.max(1, p))) - lnCdf(1)) / (lnCdf(1e8) - lnCdf(1)),
    };
    const planets: RowSpec = {
      occurrence: 0.1,
      massAt: (lnM) => Math.exp(lnM) * MJUP_MSUN,
      massNodes: logUniformRow(0.3, 10, -0.31),
      periodCdf: powerLawCdf(2, 2000, 0.26),
    };
    // Fossil: B_WD = B_MS (R_MS/R_WD)², B_MS log-normal (median 0.01 kG, 0.5 dex), for 20% of 2–4 Msun progenitors.
    const fossil = (m1: number, mwd: number) => {
      if (m1 < 2 || m1 > 4) return 0;
      const rms = m1 < 1.66 ? 1.06 * Math.pow(m1, 0.945) : 1.33 * Math.pow(m1, 0.555);
      const medianMG = 0.01e-3 * (rms / wdRadius(mwd)) ** 2;
      return 0.2 * clearsThreshold(medianMG, 0.5, 1);
    };
    const expected = quadrature(
      s,
      [planets, stars],
      (m) => Math.pow(m, 1 - 2.3), // Kroupa above 0.5 Msun, per ln M
      cummingsMist,
      (m) => Math.max(0, 1 - (10 * Math.pow(m, -2.5)) / 10), // ages uniform on [0, 10] Gyr
      fossil,
    );
    const result = runInProcess(s);
    const { value, se } = result.fraction;
    expect(Math.abs(value! - expected.magnetic)).toBeLessThan(3 * se!);
    const post = result.counts.bySetting.postCE.whiteDwarfs;
    const n = result.counts.whiteDwarfs;
    const postSe = Math.sqrt((expected.postCE * (1 - expected.postCE)) / n);
    expect(expected.postCE).toBeGreaterThan(0.01); // the check is not vacuous
    expect(Math.abs(post / n - expected.postCE)).toBeLessThan(3 * postSe);
    expect(result.counts.byChannel.fossil).toBeGreaterThan(0);
  }, 120_000);
});
