import { describe, expect, it } from 'vitest';
import { ENGINE_VERSION } from '../version.ts';
import { addPackedInto, addPackedIntoAll, addTallyToPacked, emptyPackedTallies, PACKED_TALLY_LENGTH, packTallies, unpackTally } from './packed-tally.ts';
import { addTally, ARRAY_FIELDS, emptyTallyFor, SCALAR_FIELDS, type ChunkTally } from './tally.ts';

/**
 * Packing is a change of container, so every count must come back exactly. The largest counts
 * checked sit just below 2^53 = 9,007,199,254,740,992, the end of the integers an IEEE 754 double
 * represents exactly (common practice, no source): a packing through 32-bit integers or through
 * floats of less precision would change them.
 */
const LARGE = 2 ** 53 - 1;

/** A tally whose every entry is distinct (so a shifted or swapped field shows), some near 2^53. */
function filledTally(hash: string, seed: number): ChunkTally {
  const tally = emptyTallyFor(hash);
  let k = seed;
  for (const key of SCALAR_FIELDS) tally[key] = ++k;
  for (const key of ARRAY_FIELDS) tally[key] = tally[key].map(() => ++k);
  tally.systems = LARGE - seed;
  tally.fateMap[0] = LARGE - 2 * seed;
  tally.multiplierBins[tally.multiplierBins.length - 1] = 2 ** 52 + seed;
  return tally;
}

describe('packed tallies', () => {
  it('round-trips every count exactly, including integers just below 2^53', () => {
    const tallies = [filledTally('a', 0), filledTally('b', 7), emptyTallyFor('c')];
    const packed = packTallies(tallies);
    expect(packed.counts.length).toBe(3 * PACKED_TALLY_LENGTH);
    tallies.forEach((tally, p) => expect(unpackTally(packed, p)).toEqual(tally));
    expect(unpackTally(packed, 0).systems).toBe(LARGE);
    // The JSON shape that is stored and served is unchanged: plain arrays of integers.
    expect(JSON.parse(JSON.stringify(unpackTally(packed, 1)))).toEqual(tallies[1]);
  });

  it('sums like addTally: packed sums of chunk tallies equal the summed tallies', () => {
    const chunks = [filledTally('h', 1), filledTally('h', 100), filledTally('h', 5000)].map((t) => ({ ...t, systems: 65_536 }));
    const packed = emptyPackedTallies(['x', 'h']);
    for (const tally of chunks) addTallyToPacked(packed, 1, tally);
    const expected = chunks.reduce((sum, t) => addTally(sum, t), emptyTallyFor('h'));
    expect(unpackTally(packed, 1)).toEqual(expected);
    expect(unpackTally(packed, 0)).toEqual(emptyTallyFor('x'));
    // And adding the packed counts into running totals is the same sum again.
    const totals = [filledTally('x', 3), filledTally('h', 9)];
    addPackedIntoAll(totals, packed);
    expect(totals[1]).toEqual(addTally(filledTally('h', 9), expected));
    expect(totals[0]).toEqual(filledTally('x', 3));
  });

  it('refuses tallies of another scenario, engine version, layout or point count', () => {
    const packed = emptyPackedTallies(['a', 'b']);
    expect(() => addTallyToPacked(packed, 0, emptyTallyFor('b'))).toThrow(/scenarios b and a/);
    expect(() => addPackedInto(emptyTallyFor('z'), packed, 1)).toThrow(/scenarios z and b/);
    expect(() => addPackedInto({ ...emptyTallyFor('a'), engineVersion: '0.0.1' }, packed, 0)).toThrow(`engine 0.0.1 and ${ENGINE_VERSION}`);
    expect(() => addTallyToPacked(packed, 0, { ...emptyTallyFor('a'), logField: [1, 2] })).toThrow(/logField has 2 entries/);
    expect(() => unpackTally(packed, 2)).toThrow(/point 2 is outside/);
    expect(() => addPackedIntoAll([emptyTallyFor('a')], packed)).toThrow(/2 points cannot be added to 1 running totals/);
  });
});
