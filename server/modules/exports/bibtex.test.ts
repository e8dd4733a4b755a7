import { describe, expect, it } from 'vitest';
import { bibEntries, toBibtex } from './bibtex.ts';

// BibTeX's name list: "Surname, Initials" joined by " and ", "others" for et al.
// (Patashnik 1988, BibTeXing, §4; common practice).
describe('BibTeX from methods references', () => {
  it('turns a journal citation with "&" and "et al." into an @article with BibTeX name lists', () => {
    const [hurley, kalirai] = bibEntries([
      'Hurley, J. R., Pols, O. R. & Tout, C. A. 2000, MNRAS, 315, 543',
      'Kalirai, J. S., Hansen, B. M. S., Kelson, D. D., et al. 2008, ApJ, 676, 594',
    ]);
    expect(hurley).toEqual({
      key: 'Hurley2000', type: 'article',
      fields: { author: 'Hurley, J. R. and Pols, O. R. and Tout, C. A.', year: '2000', doi: '10.1046/j.1365-8711.2000.03426.x', journal: 'MNRAS', volume: '315', pages: '543' },
    });
    expect(kalirai.fields.author).toBe('Kalirai, J. S. and Hansen, B. M. S. and Kelson, D. D. and others');
  });

  it('splits joined references, keeps each once, skips non-references and makes books @misc', () => {
    const entries = bibEntries([
      'Zahn, J.-P. 1977, A&A, 57, 383; Villaver, E. & Livio, M. 2009, ApJ, 705, L81',
      'Villaver, E. & Livio, M. 2009, ApJ, 705, L81',
      'definition',
      'Kippenhahn, R., Weigert, A. & Weiss, A. 2012, Stellar Structure and Evolution, 2nd ed. (Springer)',
    ]);
    expect(entries.map((e) => e.key)).toEqual(['Zahn1977', 'Villaver2009', 'Kippenhahn2012']);
    expect(entries[0].fields).not.toHaveProperty('doi');
    expect(entries[1].fields.pages).toBe('L81');
    expect(entries[2]).toMatchObject({ type: 'misc', fields: { title: 'Stellar Structure and Evolution, 2nd ed. (Springer)' } });
    // "&" is a special character in BibTeX field text and must be escaped.
    expect(toBibtex(entries, 'h')).toContain('journal = {A\\&A}');
  });

  it('gives two works of one first author and year distinct keys', () => {
    const keys = bibEntries(['Chabrier, G. 2003, PASP, 115, 763', 'Chabrier, G. 2003, ApJ, 586, L133']).map((e) => e.key);
    expect(keys).toEqual(['Chabrier2003', 'Chabrier2003a']);
  });
});
