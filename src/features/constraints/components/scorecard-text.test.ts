import { describe, expect, it } from 'vitest';
import { pCell, shortVerdict, sigmaCell, toneOf } from './scorecard-text.ts';

describe('scorecard wording (2, 3, 5σ thresholds; common practice, no source)', () => {
  it('words a line by its significance and never scores an unavailable one', () => {
    expect(shortVerdict({ status: 'scored', sigma: 1.2 })).toBe('consistent');
    expect(shortVerdict({ status: 'scored', sigma: 2.5 })).toBe('mild tension');
    expect(shortVerdict({ status: 'scored', sigma: 4 })).toBe('strong tension');
    expect(shortVerdict({ status: 'scored', sigma: 15.7 })).toBe('rejected');
    expect(shortVerdict({ status: 'scored', sigma: null })).toBe('rejected');
    expect(shortVerdict({ status: 'unavailable', sigma: null })).toBe('not available');
    expect(toneOf({ status: 'unavailable', sigma: null })).toBe('neutral');
    expect(sigmaCell({ status: 'unavailable', sigma: null })).toBe('—');
    expect(sigmaCell({ status: 'scored', sigma: null })).toBe('∞σ');
  });

  it('prints p-values far below a double with their exponent', () => {
    expect(pCell(0.4567)).toBe('p = 0.46');
    expect(pCell(null)).toBe('—');
    expect(pCell(0)).toBe('p = 0');
  });
});
