import { describe, expect, it } from 'vitest';
import { allowedRangeSentence, missingPoints, pointsProgress } from './sweep-text.ts';

const grid = [0.2, 0.5, 1, 2, 4];

describe('allowedRangeSentence', () => {
  it('states an interior range and that the true limits lie between grid values', () => {
    expect(allowedRangeSentence([0.5, 1], '68%', 'α_CE', '', grid)).toBe(
      'At 68% the sample allows α_CE from 0.5 to 1 among the grid values 0.2 to 4; the true limits lie between grid values.',
    );
  });

  it('warns when a limit sits at the edge of the grid', () => {
    expect(allowedRangeSentence([0.2, 1], '68%', 'α_CE', '', grid)).toMatch(/lower limit sits at the edge of the grid/);
    expect(allowedRangeSentence([1, 4], '95%', 'Engulfment reach', 'AU', grid)).toMatch(/from 1 AU to 4 AU .*upper limit sits at the edge/);
  });

  it('says when the sample allows the whole grid or none of it', () => {
    expect(allowedRangeSentence([0.2, 4], '95%', 'α_CE', '', grid)).toMatch(/does not constrain α_CE over this range/);
    expect(allowedRangeSentence(null, '68%', 'α_CE', '', grid)).toBe('At 68% no grid value of α_CE gives a prediction the sample allows.');
  });
});

describe('progress', () => {
  it('counts the points done and the ones without a result', () => {
    expect(pointsProgress({ pointCount: 5, pointsDone: 2 })).toEqual({ fraction: 0.4, text: '2 of 5 points done' });
    expect(missingPoints({ points: [{ status: 'failed' }, { status: 'succeeded' }, { status: 'cancelled' }] as never })).toBe(2);
  });
});
