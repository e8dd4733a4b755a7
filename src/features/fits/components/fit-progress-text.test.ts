import { describe, expect, it } from 'vitest';
import { cancelFitWarning, cancelledFitText, fitProgressText } from './fit-progress-text.ts';

describe('fitProgressText', () => {
  it('says the fit is preparing until its first chunk is done, not "0%" with nothing else', () => {
    expect(fitProgressText({ status: 'running', chunksDone: 0, chunkCount: 16, etaSeconds: null })).toMatch(/^Preparing/);
  });

  it('gives the time left once the server has a rate', () => {
    expect(fitProgressText({ status: 'running', chunksDone: 4, chunkCount: 16, etaSeconds: 200 })).toBe('About 3 min 20 s left.');
    expect(fitProgressText({ status: 'running', chunksDone: 1, chunkCount: 16, etaSeconds: null })).toBe('Working out the time left…');
  });

  it('says a queued fit waits for a worker', () => {
    expect(fitProgressText({ status: 'queued', chunksDone: 0, chunkCount: 16, etaSeconds: null })).toMatch(/^Queued/);
  });
});

describe('cancel texts', () => {
  // What the server does on cancel (server/modules/billing/billing.service.ts settleRun, run-scheduler's
  // cancel): the whole reservation is refunded and the checkpoint deleted. The words must say both.
  it('promises the whole reservation back and no posterior, naming the credits', () => {
    const text = cancelFitWarning({ status: 'running', costCredits: 8 });
    expect(text).toContain('Its whole reservation is given back');
    expect(text).toContain('the 8 credits reserved for it');
    expect(text).toContain('cannot be resumed');
    expect(cancelFitWarning({ status: 'queued', costCredits: 1 })).toMatch(/^The fit is taken off the queue.*the 1 credit reserved/);
    expect(cancelFitWarning({ status: 'running', costCredits: 0 })).toContain('(it reserved no credits)');
  });

  it('says how far a cancelled fit got and that nothing of it is kept', () => {
    expect(cancelledFitText({ chunksDone: 3, chunkCount: 306, costCredits: 8 }, '5 Dec 2026, 08:18 UTC')).toMatch(
      /^Cancelled 5 Dec 2026, 08:18 UTC, after 3 of 306 chunks of its one pass \(1\.0%\); those chunks were discarded, so there is no posterior.*the 8 credits reserved for it/,
    );
    expect(cancelledFitText({ chunksDone: 0, chunkCount: 306, costCredits: null })).toMatch(/^Cancelled before its first chunk was computed, so there is no posterior/);
  });
});
