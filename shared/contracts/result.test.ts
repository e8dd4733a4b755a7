import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildResult } from '../engine/result/build-result.ts';
import { prepareScenario } from '../engine/kernel/prepare.ts';
import { runChunk } from '../engine/kernel/run-chunk.ts';
import { ENGINE_VERSION, engineMajorVersion } from '../engine/version.ts';
import { scenarioResultSchema } from './result.ts';
import { parseScenario } from './scenario.ts';

// A result document written by engine 1.0.0 (check-1 with 2000 systems), kept as stored then:
// results in the database must stay readable after engine 2.
const engine1 = JSON.parse(readFileSync(new URL('./fixtures/engine-1-result.json', import.meta.url), 'utf8'));

describe('result documents of both engines', () => {
  it('parses a stored engine-1 document (core-merger channel, merged fate, none of the engine-2 bins)', () => {
    const parsed = scenarioResultSchema.parse(engine1);
    expect(engineMajorVersion(parsed.engineVersion)).toBe(1);
    expect(parsed.counts.byChannel.coreMerger).toBe(0);
    expect(parsed.counts.byChannel.closeSurvivor).toBeUndefined();
    expect(parsed.counts.companionFates.merged).toBe(0);
    expect(parsed.bins.fateMap.fates).toEqual(['wide', 'postCE', 'disrupted', 'merged']);
    expect(parsed.bins.coolingAge).toBeUndefined();
    expect(parsed.counts.magnetic).toBe(engine1.counts.magnetic);
  });

  it('an engine-2 document has exactly the engine-2 keys', () => {
    const s = parseScenario({ ...JSON.parse(readFileSync(new URL('../../tests/fixtures/check-1.json', import.meta.url), 'utf8')), systems: 2000 });
    const prepared = prepareScenario(s);
    const result = scenarioResultSchema.parse(buildResult(s, runChunk(prepared, 0), { prepared }));
    expect(result.engineVersion).toBe(ENGINE_VERSION);
    expect(engineMajorVersion(result.engineVersion)).toBe(2);
    expect(Object.keys(result.counts.byChannel).sort()).toEqual(['closeSurvivor', 'disruption', 'fossil']);
    expect(Object.keys(result.fractionByChannel).sort()).toEqual(['closeSurvivor', 'disruption', 'fossil']);
    expect(Object.keys(result.counts.channelBySetting).sort()).toEqual(['closeSurvivor', 'disruption', 'fossil']);
    expect(Object.keys(result.counts.companionFates).sort()).toEqual(['disrupted', 'dissolved', 'postCE', 'wide']);
    expect(result.bins.fateMap.fates).toEqual(['wide', 'postCE', 'disrupted', 'dissolved']);
    expect(Number.isInteger(result.counts.heliumWhiteDwarfs)).toBe(true);
    const bins = result.bins;
    expect(bins.wdMassBySetting!.edgesMsun).toEqual(bins.wdMass.edgesMsun);
    for (const setting of ['single', 'wide', 'postCE'] as const) expect(bins.wdMassBySetting![setting].magnetic).toHaveLength(bins.wdMass.magnetic.length);
    // Cooling age from 1 Myr to 14 Gyr and post-CE periods from 0.01 to 10^4 d (DESIGN), log10 edges.
    expect(bins.coolingAge!.edgesLog10Gyr[0]).toBe(-3);
    expect(bins.coolingAge!.edgesLog10Gyr.at(-1)).toBeCloseTo(Math.log10(14), 9);
    expect(bins.postCommonEnvelopePeriod!.edgesLog10Days[0]).toBe(-2);
    expect(bins.postCommonEnvelopePeriod!.edgesLog10Days.at(-1)).toBe(4);
    // The per-channel field histograms add up to the total one, bin by bin.
    const byChannel = bins.logField.byChannel!;
    bins.logField.counts.forEach((n, i) => expect(byChannel.disruption[i] + byChannel.closeSurvivor[i] + byChannel.fossil[i]).toBe(n));
    // Every sampled white dwarf is in exactly one cooling-age bin and one setting's mass bin.
    const total = (xs: number[]) => xs.reduce((a, b) => a + b, 0);
    expect(total(bins.coolingAge!.magnetic) + total(bins.coolingAge!.nonMagnetic)).toBe(result.counts.whiteDwarfs);
    expect(total(bins.coolingAge!.magnetic)).toBe(result.counts.magnetic);
    const settingSum = (['single', 'wide', 'postCE'] as const).reduce((a, k) => a + total(bins.wdMassBySetting![k].magnetic) + total(bins.wdMassBySetting![k].nonMagnetic), 0);
    expect(settingSum).toBe(result.counts.whiteDwarfs);
  });
});

describe('scenario documents of engine 1', () => {
  it('are accepted with their core-merger keys, which are ignored and named in the assumptions', () => {
    const doc = JSON.parse(readFileSync(new URL('../../tests/fixtures/check-1.json', import.meta.url), 'utf8'));
    const legacy = {
      ...doc,
      systems: 2000,
      field: { ...doc.field, coreMerger: { kind: 'lognormal', medianMG: 100, widthDex: 0.5 } },
      channels: { ...doc.channels, coreMerger: true },
    };
    const plain = parseScenario({ ...doc, systems: 2000 });
    const old = parseScenario(legacy);
    const run = (s: typeof plain) => {
      const prepared = prepareScenario(s);
      return buildResult(s, runChunk(prepared, 0), { prepared });
    };
    const a = run(plain);
    const b = run(old);
    expect(b.counts).toEqual(a.counts);
    expect(b.bins).toEqual(a.bins);
    expect(b.assumptions.some((x) => x.includes('engine-1 settings') && x.includes('ignores them'))).toBe(true);
    expect(a.assumptions.some((x) => x.includes('engine-1 settings'))).toBe(false);
  });
});
