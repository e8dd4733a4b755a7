import { describe, expect, it } from 'vitest';
import { packTallies, unpackTally } from '../../shared/engine/kernel/packed-tally.ts';
import { emptyTallyFor } from '../../shared/engine/kernel/tally.ts';
import { decodePackedTallies, encodePackedTallies } from './queue-names.ts';

describe('packed tallies through Redis', () => {
  it('survive JSON as deflated base64 bytes, every count exact (up to 2^53 − 1)', () => {
    // 2^53 − 1 is the largest integer a double holds exactly (common practice, no source).
    const tallies = Array.from({ length: 300 }, (_, p) => {
      const tally = emptyTallyFor(`hash-${p}`);
      tally.systems = 65_536 * (p + 1);
      tally.fateMap[p] = 2 ** 53 - 1 - p;
      tally.logField[p % tally.logField.length] = p;
      return tally;
    });
    const wire = JSON.parse(JSON.stringify(encodePackedTallies(packTallies(tallies))));
    // Mostly zeros: far smaller than the JSON of the tallies themselves.
    expect(wire.counts.length).toBeLessThan(JSON.stringify(tallies).length / 10);
    const back = decodePackedTallies(wire);
    tallies.forEach((tally, p) => expect(unpackTally(back, p)).toEqual(tally));
  });

  it('refuses bytes that do not hold one tally per point', () => {
    const wire = encodePackedTallies(packTallies([emptyTallyFor('a'), emptyTallyFor('b')]));
    expect(() => decodePackedTallies({ ...wire, scenarioHashes: ['a'] })).toThrow(/packed tallies of 1 points hold \d+ bytes/);
  });
});
