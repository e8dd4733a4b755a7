import { describe, expect, it } from 'vitest';
import seedrandom from 'seedrandom';
import { BINS, binIndex } from './bins.ts';
import { buildLogBinLookup, LOG_BIN_LOOKUPS, logBinIndex } from './log-bins.ts';

// Reference: the definition the kernel used before the lookup, binIndex(bins, Math.log10(x)).
describe('logBinIndex', () => {
  const names = Object.keys(LOG_BIN_LOOKUPS) as (keyof typeof LOG_BIN_LOOKUPS)[];

  it.each(names)('equals binIndex of Math.log10 for %s at random values two decades beyond either end', (name) => {
    const bins = BINS[name];
    const lookup = LOG_BIN_LOOKUPS[name];
    const u = seedrandom.xor4096(`log-bins ${name}`);
    let mismatches = 0;
    for (let i = 0; i < 200_000; i++) {
      const x = 10 ** (bins.lo - 2 + (bins.hi - bins.lo + 4) * u());
      if (logBinIndex(lookup, x) !== binIndex(bins, Math.log10(x))) mismatches++;
    }
    expect(mismatches).toBe(0);
  });

  it.each(names)('equals binIndex of Math.log10 for %s on and next to every bin edge', (name) => {
    const bins = BINS[name];
    const lookup = LOG_BIN_LOOKUPS[name];
    for (let k = 0; k <= bins.count; k++) {
      const edge = 10 ** (bins.lo + ((bins.hi - bins.lo) * k) / bins.count);
      for (const x of [edge, edge * (1 + 2 ** -52), edge * (1 - 2 ** -53), edge * (1 + 1e-12), edge * (1 - 1e-12)]) {
        expect(logBinIndex(lookup, x)).toBe(binIndex(bins, Math.log10(x)));
      }
    }
  });

  it('puts zero, tiny and huge values in the first or last bin, as binIndex does', () => {
    const bins = BINS.log10SeparationAU;
    const lookup = LOG_BIN_LOOKUPS.log10SeparationAU;
    for (const x of [0, Number.MIN_VALUE, 1e-300, 1e300, Infinity]) expect(logBinIndex(lookup, x)).toBe(binIndex(bins, Math.log10(x)));
  });

  it('refuses more bins than a cell can name', () => {
    expect(() => buildLogBinLookup({ lo: 0, hi: 1, count: 300 })).toThrow(/bins.count = 300/);
  });
});
