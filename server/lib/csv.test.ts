import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { toCsv } from './csv.ts';

// OWASP "CSV Injection": cells starting with = + - @ tab or CR are prefixed with ' (common practice).
describe('toCsv (CSV formula injection, issue 9 item 12)', () => {
  it('prefixes every formula-like text cell with an apostrophe and keeps numbers and numeric text', () => {
    const csv = toCsv(['a'], [['=1+1'], ['+1'], ['-cmd'], ['@x'], ['\tTab'], ['\rCR'], ['-1.5'], ['-.5e3'], [-2], ['plain']]);
    const cells = Papa.parse<string[]>(csv.trim()).data.slice(1).map((r) => r[0]);
    expect(cells).toEqual(["'=1+1", "'+1", "'-cmd", "'@x", "'\tTab", "'\rCR", '-1.5', '-.5e3', '-2', 'plain']);
  });
});
