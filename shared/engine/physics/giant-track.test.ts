import { describe, expect, it } from 'vitest';
import { giantTrackSchema } from '../../contracts/method-choices.ts';
import { RSUN_PER_AU } from '../constants.ts';
import { EngineError } from '../errors.ts';
import { agbLuminosityLsun } from './agb-luminosity.ts';
import { buildGiantTrack, type GiantTrack } from './giant-track.ts';

// The schema's defaults: η = 0.477, Blöcker superwind η_B = 0.05, Zahn tide.
const defaults = giantTrackSchema.parse({ kind: 'track' });
// Cummings et al. 2018 MIST-based IFMR, 0.080 Mi + 0.489 below 2.85 Msun (DESIGN).
const cummings = (mi: number) => 0.08 * mi + 0.489;
const rgbTip = (track: GiantTrack) => track.agbStartIndex - 1;

describe('analytic giant track', () => {
  const sun = buildGiantTrack(1, cummings(1), defaults);

  it("puts the Sun's red-giant tip at Mc = 0.47 with L ≈ 2000–3500 Lsun and R ≈ 150–260 Rsun (common practice, from memory; generous because published solar tips range over L ≈ 2300–3000 and R ≈ 170–256 Rsun with mass-loss and mixing-length choices)", () => {
    const tip = rgbTip(sun);
    expect(sun.coreMassMsun[tip]).toBeCloseTo(0.47, 9);
    expect(sun.luminosityLsun[tip]).toBeGreaterThan(2000);
    expect(sun.luminosityLsun[tip]).toBeLessThan(3500);
    expect(sun.radiusAU[tip] * RSUN_PER_AU).toBeGreaterThan(150);
    expect(sun.radiusAU[tip] * RSUN_PER_AU).toBeLessThan(260);
  });
  it('loses 0.1–0.3 Msun on the red giant branch of a 1 Msun star with η = 0.4–0.5 (common practice, from memory)', () => {
    for (const eta of [0.4, 0.5]) {
      const track = buildGiantTrack(1, cummings(1), { ...defaults, reimersEta: eta });
      const lost = 1 - track.massMsun[rgbTip(track)];
      expect(lost).toBeGreaterThan(0.1);
      expect(lost).toBeLessThan(0.3);
    }
  });
  it('climbs the red giant branch of a 1 Msun star in 0.3–1.5 Gyr (common practice, from memory: ~0.5–1 Gyr from the base to the tip)', () => {
    const gyr = sun.timeYr[rgbTip(sun)] / 1e9;
    expect(gyr).toBeGreaterThan(0.3);
    expect(gyr).toBeLessThan(1.5);
  });
  it('follows Paczyński (1970) on the AGB and ends at the IFMR core mass or when the envelope is gone', () => {
    for (const [m, mf] of [[1.5, cummings(1.5)], [3, 0.745], [6, 1.113]] as const) {
      const track = buildGiantTrack(m, mf, defaults);
      const last = track.timeYr.length - 1;
      for (let k = track.agbStartIndex; k <= last; k += 37) {
        expect(track.luminosityLsun[k] / agbLuminosityLsun(track.coreMassMsun[k])).toBeCloseTo(1, 12);
      }
      if (track.endReason === 'final-core-mass') expect(track.coreMassMsun[last]).toBeCloseTo(mf, 12);
      else expect(track.massMsun[last] - track.coreMassMsun[last]).toBeCloseTo(1e-3, 6);
    }
  });
  it('keeps time non-decreasing, mass non-increasing and the envelope non-negative at every node', () => {
    for (const m of [0.8, 1.2, 2.2, 4, 8]) {
      const track = buildGiantTrack(m, Math.min(0.109 * m + 0.394, 1.3), defaults);
      for (let k = 1; k < track.timeYr.length; k++) {
        expect(track.timeYr[k]).toBeGreaterThanOrEqual(track.timeYr[k - 1]);
        expect(track.massMsun[k]).toBeLessThanOrEqual(track.massMsun[k - 1]);
        expect(track.massMsun[k]).toBeGreaterThanOrEqual(track.coreMassMsun[k]);
      }
    }
  });
  it('strips more envelope with the superwind than with Reimers alone', () => {
    const withWind = buildGiantTrack(2, cummings(2), defaults);
    const without = buildGiantTrack(2, cummings(2), { ...defaults, superwind: { kind: 'none' } });
    expect(withWind.massMsun.at(-1)!).toBeLessThan(without.massMsun.at(-1)!);
  });
  it('gives a star above 2.5 Msun no red giant branch', () => {
    expect(buildGiantTrack(3, 0.745, defaults).agbStartIndex).toBe(0);
  });
  it('rejects a final core mass at or above the initial mass and a bad η, naming the parameter', () => {
    expect(() => buildGiantTrack(0.9, 0.95, defaults)).toThrow(EngineError);
    expect(() => buildGiantTrack(0.9, 0.95, defaults)).toThrow(/finalCoreMassMsun = 0.95/);
    expect(() => buildGiantTrack(1, 0.55, { ...defaults, reimersEta: 9 })).toThrow(/reimersEta = 9/);
    expect(() => buildGiantTrack(9, 1.2, defaults)).toThrow(/initialMassMsun = 9 is outside the allowed range \[0.8, 8\] Msun/);
  });
});

describe('superwind timing (engine 2)', () => {
  // DESIGN: the superwind is timed so that the core at the end of the track equals the IFMR mass.
  // 0.005 Msun is the tolerance; the bisection on the wind scale stops at 10⁻³ relative.
  const cummingsMist = (m: number) => (m < 2.85 ? 0.08 * m + 0.489 : m < 3.6 ? 0.187 * m + 0.184 : 0.107 * m + 0.471);
  const nodes = Array.from({ length: 24 }, (_, i) => 0.95 * (8 / 0.95) ** (i / 23));
  for (const eta of [0.05, 0.5]) {
    it(`ends every track of a 24-node grid (0.95–8 Msun, Cummings et al. 2018 MIST IFMR) at the IFMR mass within 0.005 Msun, η_B = ${eta}`, () => {
      const options = giantTrackSchema.parse({ kind: 'track', superwind: { kind: 'bloecker1995', eta } });
      for (const m1 of nodes) {
        const track = buildGiantTrack(m1, cummingsMist(m1), options);
        expect(Math.abs(track.coreMassMsun.at(-1)! - cummingsMist(m1)), `M1 = ${m1}`).toBeLessThan(0.005);
        expect(track.endReason, `M1 = ${m1}`).toBe('final-core-mass');
      }
    }, 60_000);
  }
  it('scales the AGB wind down only where it would empty the envelope first (η_B = 0.5 strips a 3 Msun star early)', () => {
    const strong = buildGiantTrack(3, cummingsMist(3), giantTrackSchema.parse({ kind: 'track', superwind: { kind: 'bloecker1995', eta: 0.5 } }));
    expect(strong.agbWindScale).toBeLessThan(1);
    const weak = buildGiantTrack(1, cummingsMist(1), giantTrackSchema.parse({ kind: 'track' }));
    expect(weak.agbWindScale).toBe(1);
  });
});

