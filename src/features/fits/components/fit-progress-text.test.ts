import { describe, expect, it } from 'vitest';
import { fitProgressText } from './fit-progress-text.ts';

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
