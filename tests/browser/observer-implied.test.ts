/**
 * The observer's question in the browser: choose a scenario and a sample, start the run, and
 * read the range of companion occurrence the sample allows, in words and drawn. The answer the
 * page shows is checked against the exact binomial test of R's binom.test, recomputed with jstat
 * (tests/support/binomial-reference.ts) on the response curve the server sent.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { impliedSentence } from '../../src/features/implied/components/implied-text.ts';
import { binomTestTwoSided } from '../support/binomial-reference.ts';
import { chooseOption, startBrowserStack, type BrowserStack } from '../support/browser.ts';

let stack: BrowserStack;
beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

interface Answer {
  interval68: [number, number] | null;
  interval95: [number, number] | null;
  bestFit: number;
  curve: { multiplier: number; fraction: number }[];
  sample: { magnetic: number; total: number };
}

/** The predicted fraction at multiplier m, linear between the curve's points (as the engine defines it). */
function fractionAt(curve: Answer['curve'], m: number): number {
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1];
    const b = curve[i];
    if (m <= b.multiplier) return a.fraction + ((b.fraction - a.fraction) * (m - a.multiplier)) / (b.multiplier - a.multiplier);
  }
  return curve[curve.length - 1].fraction;
}

describe('observer', () => {
  it('asks what occurrence the demo pilot sample implies', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/implied-occurrence');
      await chooseOption(page.getByLabel('Scenario'), 'Baseline, fixed engulfment reach');
      await chooseOption(page.getByLabel('Observed sample'), 'Harrowgate 40 pc pilot survey (illustrative)');
      await page.getByLabel('Systems').fill('200000');
      const response = page.waitForResponse((r) => r.url().includes('/implied-occurrence?') && r.status() === 200, { timeout: 120_000 });
      await page.getByRole('button', { name: 'Find the implied occurrence' }).click();
      const answer = (await (await response).json()) as Answer;
      await page.locator('figure svg').first().waitFor({ timeout: 30_000 });

      // The demo seed's invented pilot survey: 9 magnetic of 78 (server/seed/demo.ts).
      expect(answer.sample).toMatchObject({ magnetic: 9, total: 78 });
      const { magnetic: k, total: n } = answer.sample;
      const curve = answer.curve;
      expect(curve.length).toBeGreaterThan(1);
      const [lo, hi] = [curve[0].multiplier, curve[curve.length - 1].multiplier];

      // The best fit reproduces the observed 9/78 when the curve spans it (linear interpolation is exact).
      const fractions = curve.map((c) => c.fraction);
      if (Math.min(...fractions) <= k / n && k / n <= Math.max(...fractions)) {
        expect(fractionAt(curve, answer.bestFit)).toBeCloseTo(k / n, 9);
      }

      // Each interval holds multipliers the test accepts, and just beyond an end that is not the
      // curve's edge it rejects (5% of the interval's width outside, so no tie at the boundary).
      for (const [interval, level] of [[answer.interval68, 0.68], [answer.interval95, 0.95]] as const) {
        if (interval === null) continue;
        const alpha = 1 - level;
        const [a, b] = interval;
        expect(binomTestTwoSided(k, n, fractionAt(curve, (a + b) / 2))).toBeGreaterThanOrEqual(alpha);
        const margin = 0.05 * (b - a);
        if (a > lo && margin > 0) expect(binomTestTwoSided(k, n, fractionAt(curve, Math.max(lo, a - margin)))).toBeLessThan(alpha);
        if (b < hi && margin > 0) expect(binomTestTwoSided(k, n, fractionAt(curve, Math.min(hi, b + margin)))).toBeLessThan(alpha);
      }
      expect(answer.interval95).not.toBeNull();

      // The page says exactly this answer in words.
      await page.getByText(impliedSentence(answer)).first().waitFor({ timeout: 10_000 });
      await stack.screenshot(page, 'observer-implied-occurrence');
    } finally {
      await context.close();
    }
  });
});
