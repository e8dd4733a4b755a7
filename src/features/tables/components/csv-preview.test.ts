import { describe, expect, it } from 'vitest';
import { csvTemplate, linesToShow, previewLines } from './csv-preview.ts';
import type { RowCells } from '../../../../shared/contracts/occurrence-row-cells.ts';
import { checkCells } from '../../../components/companion-row-cells.ts';

describe('previewLines', () => {
  const csv = 'class,massUnit,occurrence\nplanet,MJup,0.1\n\ncomet,MJup,5\nstar,q,0.2\n';

  it('numbers lines as the server does and puts each problem on its line', () => {
    const preview = previewLines(csv, [
      { line: 3, column: 'class', message: 'class must be one of planet, brownDwarf, star (got "comet")' },
      { line: 1, column: 'periodMinDays', message: 'the header has no column periodMinDays' },
    ]);
    expect(preview.header).toEqual(['class', 'massUnit', 'occurrence']);
    expect(preview.lines.map((l) => [l.line, l.cells.class, l.problems.length])).toEqual([
      [2, 'planet', 0],
      [3, 'comet', 1],
      [4, 'star', 0],
    ]);
    expect(preview.fileProblems).toHaveLength(1);
  });

  it('shows every line with a problem before filling up with the first lines', () => {
    const lines = [2, 3, 4, 5].map((line) => ({ line, cells: {}, problems: line === 5 ? [{ line, message: 'bad' }] : [] }));
    expect(linesToShow(lines, 2).map((l) => l.line)).toEqual([2, 5]);
  });
});

describe('csvTemplate', () => {
  it('holds rows the row check accepts', () => {
    const { lines } = previewLines(csvTemplate(), []);
    expect(lines).toHaveLength(2);
    for (const l of lines) expect(checkCells(l.cells as RowCells).ok).toBe(true);
  });
});
