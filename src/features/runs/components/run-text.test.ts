import { describe, expect, it } from 'vitest';
import { formatComputeTime, formatDuration, parseSystemsInput, tensionInWords } from './run-text.ts';

describe('formatDuration', () => {
  it('reads like a person would say it', () => {
    expect(formatDuration(0.2)).toBe('1 s');
    expect(formatDuration(42)).toBe('42 s');
    expect(formatDuration(130)).toBe('2 min 10 s');
    expect(formatDuration(180)).toBe('3 min');
    expect(formatDuration(14 * 60 + 20)).toBe('14 min');
    expect(formatDuration(3600 + 5 * 60 + 10)).toBe('1 h 5 min');
    expect(formatDuration(7200)).toBe('2 h');
  });

  it('gives compute times below a second in milliseconds', () => {
    expect(formatComputeTime(203)).toBe('203 ms');
    expect(formatComputeTime(61_000)).toBe('1 min 1 s');
  });
});

describe('parseSystemsInput', () => {
  it('reads the ways a modeller writes a large number', () => {
    expect(parseSystemsInput('1e6')).toBe(1e6);
    expect(parseSystemsInput('2.5E7')).toBe(2.5e7);
    expect(parseSystemsInput('10^8')).toBe(1e8);
    expect(parseSystemsInput('3 × 10^6')).toBe(3e6);
    expect(parseSystemsInput('1,000,000')).toBe(1e6);
    expect(parseSystemsInput(' 1 000 000 ')).toBe(1e6);
    expect(parseSystemsInput('1_000')).toBe(1000);
  });

  it('says "nothing typed" and "not a number" apart', () => {
    expect(parseSystemsInput('  ')).toBeNull();
    expect(parseSystemsInput('lots')).toBeNaN();
    expect(parseSystemsInput('-5')).toBeNaN();
  });
});

describe('tensionInWords', () => {
  // Thresholds by convention (common practice, no source): 2σ ↔ p = 0.0455, 3σ ↔ 0.0027, 5σ ↔ 5.7e-7.
  it('follows the usual 2σ, 3σ and 5σ conventions', () => {
    expect(tensionInWords(0.8)).toMatch(/^No significant tension/);
    expect(tensionInWords(2.4)).toMatch(/^Mild tension/);
    expect(tensionInWords(3.1)).toMatch(/^Significant tension/);
    expect(tensionInWords(6.2)).toBe('The prediction is excluded at 5σ or more.');
  });

  it('reads a null sigma as infinitely many σ', () => {
    expect(tensionInWords(null)).toMatch(/zero probability/);
  });
});
