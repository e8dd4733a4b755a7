import { describe, expect, it } from 'vitest';
import { giantTrackSchema } from '../../contracts/method-choices.ts';
import { MJUP_MSUN } from '../constants.ts';
import { EngineError } from '../errors.ts';
import { buildGiantTrack } from './giant-track.ts';
import { evolveOrbitAlongTrack } from './orbit-evolution.ts';
import { widenedSeparationAU } from './orbit-mass-loss.ts';

// The schema's defaults: η = 0.477, Blöcker superwind η_B = 0.05, Zahn tide.
const defaults = giantTrackSchema.parse({ kind: 'track' });
const sun = buildGiantTrack(1, 0.569, defaults);
const twoSolar = buildGiantTrack(2, 0.649, defaults);

describe('orbit along the giant track', () => {
  it('with the tide off, conserves a · M_total exactly (Jeans 1924 via orbit-mass-loss.ts; 1e-12 relative)', () => {
    for (const [m2, a0] of [[MJUP_MSUN, 5], [0.3, 12], [1e-4, 40]]) {
      const out = evolveOrbitAlongTrack(sun, m2, a0, { kind: 'none' });
      expect(out.engulfed).toBe(false);
      const expected = widenedSeparationAU(a0, sun.massMsun[0] + m2, sun.massMsun.at(-1)! + m2);
      expect(out.separationAU / expected).toBeCloseTo(1, 12);
    }
  });
  it('never leaves the orbit wider with the tide than without it (the tide only removes angular momentum)', () => {
    for (const a0 of [3, 4, 6, 10]) {
      const tide = evolveOrbitAlongTrack(twoSolar, 0.01, a0, defaults.tide);
      const none = evolveOrbitAlongTrack(twoSolar, 0.01, a0, { kind: 'none' });
      if (!tide.engulfed) expect(tide.separationAU).toBeLessThanOrEqual(none.separationAU);
    }
  });
  it('leaves a distant orbit (50 AU, tidal rate ∝ a^−8) at the pure mass-loss value (1e-9 relative)', () => {
    const tide = evolveOrbitAlongTrack(sun, MJUP_MSUN, 50, defaults.tide);
    const none = evolveOrbitAlongTrack(sun, MJUP_MSUN, 50, { kind: 'none' });
    expect(tide.separationAU / none.separationAU).toBeCloseTo(1, 9);
  });
  it('engulfs a Jupiter-mass planet at 1 AU and spares one at 8 AU around 1 and 2 Msun stars (Villaver & Livio 2009, Mustill & Villaver 2012: engulfed inside ~1–3 AU, survives well beyond ~5 AU; from memory)', () => {
    for (const track of [sun, twoSolar]) {
      expect(evolveOrbitAlongTrack(track, MJUP_MSUN, 1, defaults.tide).engulfed).toBe(true);
      expect(evolveOrbitAlongTrack(track, MJUP_MSUN, 8, defaults.tide).engulfed).toBe(false);
    }
  });
  it('engulfs at once an orbit that starts inside the star', () => {
    const out = evolveOrbitAlongTrack(sun, MJUP_MSUN, sun.radiusAU[0] / 2, defaults.tide);
    expect(out.engulfed).toBe(true);
    expect(out.timeYr).toBe(0);
  });
  it('rejects a non-positive separation or companion mass, naming the parameter', () => {
    expect(() => evolveOrbitAlongTrack(sun, MJUP_MSUN, -1, defaults.tide)).toThrow(EngineError);
    expect(() => evolveOrbitAlongTrack(sun, 0, 1, defaults.tide)).toThrow(/companionMassMsun = 0/);
  });
});
