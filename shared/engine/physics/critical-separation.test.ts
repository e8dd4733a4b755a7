import { describe, expect, it } from 'vitest';
import { giantTrackSchema } from '../../contracts/method-choices.ts';
import { MJUP_MSUN } from '../constants.ts';
import { criticalSeparationOnTrackAU } from './critical-separation.ts';
import { buildGiantTrack } from './giant-track.ts';
import { evolveOrbitAlongTrack } from './orbit-evolution.ts';

// The schema's defaults: η = 0.477, Blöcker superwind η_B = 0.05, Zahn tide.
const defaults = giantTrackSchema.parse({ kind: 'track' });
const tracks = {
  1: buildGiantTrack(1, 0.569, defaults),
  2: buildGiantTrack(2, 0.649, defaults),
  5: buildGiantTrack(5, 1.006, defaults),
};

describe('critical separation for engulfment', () => {
  it('is a sharp boundary: every a0 inside is engulfed and every a0 outside survives (the monotonicity assumption, checked at a few points)', () => {
    for (const [track, m2] of [[tracks[1], MJUP_MSUN], [tracks[2], 0.05], [tracks[5], 0.5]] as const) {
      const acrit = criticalSeparationOnTrackAU(track, m2, defaults.tide);
      for (const f of [0.3, 0.6, 0.9, 0.98, 0.998]) {
        expect(evolveOrbitAlongTrack(track, m2, f * acrit, defaults.tide).engulfed).toBe(true);
      }
      for (const f of [1.002, 1.02, 1.1, 1.5, 3]) {
        expect(evolveOrbitAlongTrack(track, m2, f * acrit, defaults.tide).engulfed).toBe(false);
      }
    }
  });
  it('with the tide off, is the no-tide Roche-lobe boundary max [R(t)/r_L(t)] M_total(t)/M_total(0) (orbit-mass-loss.ts; Eggleton 1983 r_L written out here), and the tide only pushes it out', () => {
    const track = tracks[1];
    const bare = criticalSeparationOnTrackAU(track, MJUP_MSUN, { kind: 'none' });
    // Eggleton 1983, eq. 2, typed in: r_L/a = 0.49 q^(2/3) / (0.6 q^(2/3) + ln(1 + q^(1/3))).
    const rL = (q: number) => (0.49 * q ** (2 / 3)) / (0.6 * q ** (2 / 3) + Math.log(1 + q ** (1 / 3)));
    let expected = 0;
    for (let k = 0; k < track.radiusAU.length; k++) {
      expected = Math.max(expected, ((track.radiusAU[k] / rL(track.massMsun[k] / MJUP_MSUN)) * (track.massMsun[k] + MJUP_MSUN)) / (track.massMsun[0] + MJUP_MSUN));
    }
    expect(bare / expected).toBeCloseTo(1, 12);
    expect(evolveOrbitAlongTrack(track, MJUP_MSUN, bare * 0.999, { kind: 'none' }).engulfed).toBe(true);
    expect(evolveOrbitAlongTrack(track, MJUP_MSUN, bare * 1.001, { kind: 'none' }).engulfed).toBe(false);
    expect(criticalSeparationOnTrackAU(track, MJUP_MSUN, defaults.tide)).toBeGreaterThan(bare);
  });
  it('lies between 1 and 6 AU for a Jupiter-mass planet around 1–2 Msun stars (Villaver & Livio 2009; Mustill & Villaver 2012: engulfed inside ~1–3 AU, survives well beyond ~5 AU; from memory, generous)', () => {
    for (const track of [tracks[1], tracks[2]]) {
      const acrit = criticalSeparationOnTrackAU(track, MJUP_MSUN, defaults.tide);
      expect(acrit).toBeGreaterThan(1);
      expect(acrit).toBeLessThan(6);
    }
  });
  it('grows with companion mass: heavier companions raise a stronger tide and are engulfed from farther out (Mustill & Villaver 2012, from memory)', () => {
    for (const track of [tracks[1], tracks[2], tracks[5]]) {
      let previous = 0;
      for (const m2 of [1e-4, MJUP_MSUN, 0.01, 0.08, 0.3, 1]) {
        const acrit = criticalSeparationOnTrackAU(track, m2, defaults.tide);
        expect(acrit).toBeGreaterThan(previous);
        previous = acrit;
      }
    }
  });
  it('returns the same boundary with or without a correct hint, and ignores a wrong one', () => {
    const track = tracks[2];
    const plain = criticalSeparationOnTrackAU(track, 0.01, defaults.tide);
    const lighter = criticalSeparationOnTrackAU(track, 0.001, defaults.tide);
    // Bisection tolerance 5e-4 in ln a: two brackets may land up to that far apart.
    expect(Math.abs(Math.log(criticalSeparationOnTrackAU(track, 0.01, defaults.tide, lighter) / plain))).toBeLessThan(5e-4);
    expect(Math.abs(Math.log(criticalSeparationOnTrackAU(track, 0.01, defaults.tide, 1000) / plain))).toBeLessThan(5e-4);
  });
});
