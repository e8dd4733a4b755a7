import { describe, expect, it } from 'vitest';
import { allowancePeriod, CREDIT_PACKS, listPriceCredits, quoteRun } from './pricing.ts';

// The rule of shared/contracts/pricing.ts (Tidefield's own pricing; no outside source).
describe('quoteRun', () => {
  it('uses free systems first, then one credit per 10^7 systems rounded up', () => {
    expect(quoteRun(1_000_000, 500_000_000)).toEqual({ systems: 1e6, freeSystemsUsed: 1e6, billableSystems: 0, credits: 0 });
    expect(quoteRun(600_000_000, 500_000_000)).toEqual({ systems: 6e8, freeSystemsUsed: 5e8, billableSystems: 1e8, credits: 10 });
    expect(quoteRun(120_000_000, 0).credits).toBe(12);
    expect(quoteRun(120_000_001, 0).credits).toBe(13);
    expect(quoteRun(1000, 0).credits).toBe(1);
    expect(quoteRun(1000, 999).credits).toBe(1);
    expect(quoteRun(1000, -5).freeSystemsUsed).toBe(0);
    expect(() => quoteRun(-1, 0)).toThrow(/systems/);
  });

  it('gives the list price without any allowance, and months in UTC', () => {
    expect(listPriceCredits(1_000_000)).toBe(1);
    expect(listPriceCredits(1e10)).toBe(1000);
    expect(allowancePeriod(new Date('2026-03-31T23:59:59Z'))).toBe('2026-03');
    expect(allowancePeriod(new Date('2026-04-01T00:00:00Z'))).toBe('2026-04');
  });

  it('sells packs with distinct ids and lookup keys, each cheaper per credit than the smaller', () => {
    expect(new Set(CREDIT_PACKS.map((p) => p.id)).size).toBe(CREDIT_PACKS.length);
    expect(new Set(CREDIT_PACKS.map((p) => p.lookupKey)).size).toBe(CREDIT_PACKS.length);
    const perCredit = CREDIT_PACKS.map((p) => p.unitAmount / p.credits);
    for (let i = 1; i < perCredit.length; i++) expect(perCredit[i]).toBeLessThan(perCredit[i - 1]);
  });
});
