import { describe, expect, it } from 'vitest';
import { etaText, impliedSentence, multiplierRangeWords, occurrenceRows, scaledOccurrence, cancelledQuestionText } from './implied-text.ts';

// A response like the demo baseline against 9 of 78 (the server's answer for that run, rounded).
const curve = [
  { multiplier: 0, fraction: 0 },
  { multiplier: 2, fraction: 0.18 },
  { multiplier: 4.35, fraction: 0.38 },
];

describe('impliedSentence', () => {
  it('states both intervals and the best fit at the resolution of the widest interval', () => {
    expect(impliedSentence({ interval68: [0.9652, 1.8071], interval95: [0.6548, 2.2757], bestFit: 1.2735, curve })).toBe(
      'The sample allows between 0.97 and 1.8 times the table’s companion occurrence at 68% confidence, and between 0.65 and 2.3 times at 95%. The best fit is 1.3 times.',
    );
  });

  it('says "at most" when an interval reaches no companions at all, and why it stops at the top', () => {
    const text = impliedSentence({ interval68: [0, 0.4], interval95: [0, 4.35], bestFit: 0, curve });
    expect(text).toMatch(/^The sample allows at most 0.40 times .* at 68% confidence, and anything from 0 to 4.3 times at 95%\./);
    expect(text).toMatch(/would pass 100%/);
  });

  it('says when no multiplier reproduces the sample', () => {
    expect(impliedSentence({ interval68: null, interval95: null, bestFit: 4.35, curve })).toMatch(/^No multiple of the table’s companion occurrence from 0 to 4.3 reproduces the sample.*spans 0% to 38%/);
  });
});

describe('multiplierRangeWords', () => {
  it('uses "at least" for an interval that reaches the largest multiplier', () => {
    expect(multiplierRangeWords([1.5, 4.35], [0, 4.35], 2.85)).toBe('at least 1.5 times');
  });
});

describe('occurrence rows', () => {
  it('reads the rows of a resolved document and scales them, capped at 100%', () => {
    const rows = occurrenceRows({ companions: { multiplier: 1, rows: [{ label: 'Giant planets', occurrence: 0.105 }, { class: 'star', occurrence: 0.23 }] } });
    expect(rows).toEqual([
      { label: 'Giant planets', occurrence: 0.105 },
      { label: 'star 2', occurrence: 0.23 },
    ]);
    expect(scaledOccurrence(rows![0], 2)).toBe('21%');
    expect(scaledOccurrence(rows![1], 5)).toBe('100%');
    expect(occurrenceRows({ companions: { tableId: 'abc' } })).toBeNull();
  });
});

describe('etaText', () => {
  it('says seconds, then minutes, and nothing when unknown', () => {
    expect(etaText(null)).toBeNull();
    expect(etaText(0.2)).toBe('about 1 s left');
    expect(etaText(42)).toBe('about 42 s left');
    expect(etaText(400)).toBe('about 7 min left');
  });
});

describe('cancelledQuestionText', () => {
  // The server refunds the whole reservation on cancel and deletes the checkpoint (billing settleRun, run-scheduler cancel).
  it('says how far the fit got, that it was discarded, and what came back', () => {
    expect(cancelledQuestionText({ progress: 0.25, costCredits: 13 })).toBe(
      'Cancelled after 25% of its one pass, which was discarded: there is no answer. Its whole reservation was given back (13 credits, and any free systems taken from this month’s allowance). Ask again above.',
    );
    expect(cancelledQuestionText({ progress: 0, costCredits: 0 })).toMatch(/^Cancelled before its first chunk was computed: there is no answer\. Its whole reservation was given back \(any free systems/);
  });
});
