/**
 * The observer's question in the browser: choose a scenario and a sample, start the fit over the
 * multiplier, and read both answers, in words and drawn. The confidence range the page shows is
 * checked against the exact binomial test of R's binom.test, recomputed with jstat
 * (tests/support/binomial-reference.ts) on the response curve the server sent; the credible
 * interval against an independent integration of the binomial likelihood on that curve
 * (tests/support/implied-reference.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { IMPLIED_CONFIDENCE_LABEL, IMPLIED_CREDIBLE_LABEL, type ImpliedOccurrenceAnswer } from '../../shared/contracts/implied-occurrence.ts';
import { impliedSentence } from '../../src/features/implied/components/implied-text.ts';
import { binomTestTwoSided } from '../support/binomial-reference.ts';
import { chooseOption, startBrowserStack, type BrowserStack } from '../support/browser.ts';
import { credibleReference, fractionAt } from '../support/implied-reference.ts';

let stack: BrowserStack;
beforeAll(async () => {
  stack = await startBrowserStack();
});
afterAll(() => stack?.stop());

describe('observer', () => {
  it('asks what occurrence the demo pilot sample implies', async () => {
    const { page, context } = await stack.newPage();
    try {
      await stack.signIn(page, 'observer');
      await page.goto('/implied-occurrence');
      await chooseOption(page.getByLabel('Scenario'), 'Baseline, fixed engulfment reach');
      await chooseOption(page.getByLabel('Observed sample'), 'Harrowgate 40 pc pilot survey (illustrative)');
      await page.getByLabel('Systems').fill('200000');
      // The answer once both parts are in (the page polls the fit until then).
      const response = page.waitForResponse(
        async (r) => r.url().includes('/api/implied-occurrence/') && r.status() === 200 && (await r.json()).credible !== null,
        { timeout: 240_000 },
      );
      await page.getByRole('button', { name: 'Find the implied occurrence' }).click();
      const body = (await (await response).json()) as ImpliedOccurrenceAnswer;
      const answer = { ...body.confidence!, sample: body.sample };
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

      // The fit's grid: m from 0 to 1 / 0.23, the baseline table's largest row occurrence
      // (shared/scenarios/baseline-fixed-reach.json), with a uniform prior.
      const credible = body.credible!;
      expect(credible.prior).toBe('uniform');
      expect(credible.grid.min).toBe(0);
      expect(credible.grid.max).toBeCloseTo(1 / 0.23, 12);
      expect(hi).toBeCloseTo(1 / 0.23, 12);
      // The credible interval against the binomial likelihood on the same curve under a uniform
      // prior, integrated independently (jstat, 2^16 sub-steps). The fit's density is linear between
      // its nodes (spacing h = 4.35/128 = 0.034); for a posterior of width σ ≈ 0.3 (78 white
      // dwarfs) that errs by about (h/σ)²/8 ≈ 0.2% of the density, far below h/10, the tolerance.
      const reference = credibleReference(curve, k, n);
      const h = (credible.grid.max - credible.grid.min) / (credible.grid.points - 1);
      for (const key of ['interval68', 'interval95'] as const) {
        credible[key].forEach((x, i) => expect(Math.abs(x - reference[key][i])).toBeLessThan(h / 10));
      }

      // The page says both answers, each under its own label.
      await page.getByRole('heading', { name: IMPLIED_CONFIDENCE_LABEL }).waitFor({ timeout: 10_000 });
      await page.getByText(impliedSentence(answer)).first().waitFor({ timeout: 10_000 });
      await page.getByRole('heading', { name: IMPLIED_CREDIBLE_LABEL }).waitFor({ timeout: 10_000 });
      await page.getByText(credible.summary).first().waitFor({ timeout: 10_000 });
      await page.getByText(`Prior: ${credible.priorText}.`).waitFor({ timeout: 10_000 });
      const methods = await page.getByRole('region', { name: 'Methods text' }).innerText();
      expect(methods).toContain(`${IMPLIED_CONFIDENCE_LABEL}: ${answer.summary}`);
      expect(methods).toContain(`${IMPLIED_CREDIBLE_LABEL}: ${credible.summary}`);
      await stack.screenshot(page, 'observer-implied-occurrence');
    } finally {
      await context.close();
    }
  });
});
