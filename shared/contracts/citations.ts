/**
 * Every published source Tidefield cites, once: the short form the builder and the methods
 * paragraph print ("Kroupa 2001"), the full reference of the reference list, and the DOI where
 * it is known for certain (each DOI's journal, volume and first page agree with the reference;
 * none is guessed; books, software and journals without DOIs have none). The client links a
 * citation to https://doi.org/<doi> and never fetches it.
 */
export interface Citation {
  short: string;
  full: string;
  doi?: string;
}

export const CITATIONS = {
  salpeter: { short: 'Salpeter 1955', full: 'Salpeter, E. E. 1955, ApJ, 121, 161', doi: '10.1086/145971' },
  kroupa: { short: 'Kroupa 2001', full: 'Kroupa, P. 2001, MNRAS, 322, 231', doi: '10.1046/j.1365-8711.2001.04022.x' },
  chabrier: { short: 'Chabrier 2003', full: 'Chabrier, G. 2003, PASP, 115, 763', doi: '10.1086/376392' },
  press: { short: 'Press et al. 1992', full: 'Press, W. H., Teukolsky, S. A., Vetterling, W. T. & Flannery, B. P. 1992, Numerical Recipes, 2nd ed. (Cambridge University Press), §7.2' },
  /**
   * t_MS ≈ 10 Gyr (M/Msun)^-2.5 as a textbook scaling (t ∝ M/L with L ∝ M^3.5); the builder and
   * the paragraph once cited different books for it. Stellar Interiors states the scaling (from
   * memory: the book could not be re-read here; the value is a user option, not a hidden constant).
   */
  hansen: { short: 'Hansen, Kawaler & Trimble 2004', full: 'Hansen, C. J., Kawaler, S. D. & Trimble, V. 2004, Stellar Interiors, 2nd ed. (Springer)' },
  kalirai: { short: 'Kalirai et al. 2008', full: 'Kalirai, J. S., Hansen, B. M. S., Kelson, D. D., et al. 2008, ApJ, 676, 594', doi: '10.1086/527028' },
  cummings: { short: 'Cummings et al. 2018', full: 'Cummings, J. D., Kalirai, J. S., Tremblay, P.-E., Ramirez-Ruiz, E. & Choi, J. 2018, ApJ, 866, 21', doi: '10.3847/1538-4357/aadfd6' },
  cumming: { short: 'Cumming et al. 2008', full: 'Cumming, A., Butler, R. P., Marcy, G. W., et al. 2008, PASP, 120, 531', doi: '10.1086/588487' },
  raghavan: { short: 'Raghavan et al. 2010', full: 'Raghavan, D., McAlister, H. A., Henry, T. J., et al. 2010, ApJS, 190, 1', doi: '10.1088/0067-0049/190/1/1' },
  duquennoy: { short: 'Duquennoy & Mayor 1991', full: 'Duquennoy, A. & Mayor, M. 1991, A&A, 248, 485' },
  wichura: { short: 'Wichura 1988', full: 'Wichura, M. J. 1988, Applied Statistics, 37, 477 (algorithm AS 241)', doi: '10.2307/2347330' },
  brent: { short: 'Brent 2007', full: 'Brent, R. P. 2007, ANZIAM Journal, 48, C188 (xorgens); seedrandom xor4096 implementation' },
  jeans: { short: 'Jeans 1924', full: 'Jeans, J. H. 1924, MNRAS, 85, 2', doi: '10.1093/mnras/85.1.2' },
  hurley: { short: 'Hurley, Pols & Tout 2000', full: 'Hurley, J. R., Pols, O. R. & Tout, C. A. 2000, MNRAS, 315, 543', doi: '10.1046/j.1365-8711.2000.03426.x' },
  reimers: { short: 'Reimers 1975', full: 'Reimers, D. 1975, Mém. Soc. R. Sci. Liège, 8, 369' },
  mcdonald: { short: 'McDonald & Zijlstra 2015', full: 'McDonald, I. & Zijlstra, A. A. 2015, MNRAS, 448, 502' },
  bloecker: { short: 'Blöcker 1995', full: 'Blöcker, T. 1995, A&A, 297, 727' },
  paczynski: { short: 'Paczyński 1970', full: 'Paczyński, B. 1970, Acta Astronomica, 20, 47' },
  zahn: { short: 'Zahn 1977', full: 'Zahn, J.-P. 1977, A&A, 57, 383' },
  villaver: { short: 'Villaver & Livio 2009', full: 'Villaver, E. & Livio, M. 2009, ApJ, 705, L81', doi: '10.1088/0004-637X/705/1/L81' },
  mustill: { short: 'Mustill & Villaver 2012', full: 'Mustill, A. J. & Villaver, E. 2012, ApJ, 761, 121', doi: '10.1088/0004-637X/761/2/121' },
  webbink: { short: 'Webbink 1984', full: 'Webbink, R. F. 1984, ApJ, 277, 355', doi: '10.1086/161701' },
  dekool: { short: 'de Kool 1990', full: 'de Kool, M. 1990, ApJ, 358, 189', doi: '10.1086/168974' },
  eggleton: { short: 'Eggleton 1983', full: 'Eggleton, P. P. 1983, ApJ, 268, 368', doi: '10.1086/160960' },
  rees: { short: 'Rees 1988', full: 'Rees, M. J. 1988, Nature, 333, 523', doi: '10.1038/333523a0' },
  ryu: { short: 'Ryu et al. 2020', full: 'Ryu, T., Krolik, J., Piran, T. & Noble, S. C. 2020, ApJ, 904, 98' },
  nauenberg: { short: 'Nauenberg 1972', full: 'Nauenberg, M. 1972, ApJ, 175, 417', doi: '10.1086/151568' },
  chabrierBaraffe: { short: 'Chabrier & Baraffe 2000', full: 'Chabrier, G. & Baraffe, I. 2000, ARA&A, 38, 337', doi: '10.1146/annurev.astro.38.1.337' },
  demircan: { short: 'Demircan & Kahraman 1991', full: 'Demircan, O. & Kahraman, G. 1991, Ap&SS, 181, 313' },
  ferrario: { short: 'Ferrario et al. 2015', full: 'Ferrario, L., de Martino, D. & Gänsicke, B. T. 2015, Space Sci. Rev., 191, 111', doi: '10.1007/s11214-015-0152-0' },
  fkr: { short: 'Frank, King & Raine 2002', full: 'Frank, J., King, A. & Raine, D. 2002, Accretion Power in Astrophysics, 3rd ed. (Cambridge University Press), chs. 5 and 6' },
  shakura: { short: 'Shakura & Sunyaev 1973', full: 'Shakura, N. I. & Sunyaev, R. A. 1973, A&A, 24, 337' },
  wickramasinghe: { short: 'Wickramasinghe & Ferrario 2005', full: 'Wickramasinghe, D. T. & Ferrario, L. 2005, MNRAS, 356, 1576', doi: '10.1111/j.1365-2966.2004.08603.x' },
  mestel: { short: 'Mestel 1952', full: 'Mestel, L. 1952, MNRAS, 112, 583', doi: '10.1093/mnras/112.6.583' },
  schmidt: { short: 'Schmidt 1968', full: 'Schmidt, M. 1968, ApJ, 151, 393', doi: '10.1086/149446' },
  clopper: { short: 'Clopper & Pearson 1934', full: 'Clopper, C. J. & Pearson, E. S. 1934, Biometrika, 26, 404', doi: '10.1093/biomet/26.4.404' },
  tout: { short: 'Tout et al. 2008', full: 'Tout, C. A., Wickramasinghe, D. T., Liebert, J., Ferrario, L. & Pringle, J. E. 2008, MNRAS, 387, 897' },
  briggs: { short: 'Briggs et al. 2015', full: 'Briggs, G. P., Ferrario, L., Tout, C. A., Wickramasinghe, D. T. & Hurley, J. R. 2015, MNRAS, 447, 1713' },
  nordhaus: { short: 'Nordhaus et al. 2011', full: 'Nordhaus, J., Wellons, S., Spiegel, D. S., Metzger, B. D. & Blackman, E. G. 2011, PNAS, 108, 3135' },
  johnson: { short: 'Johnson et al. 2010', full: 'Johnson, J. A., Aller, K. M., Howard, A. W. & Crepp, J. R. 2010, PASP, 122, 905' },
} as const satisfies Record<string, Citation>;

export type CitationKey = keyof typeof CITATIONS;

/**
 * How a declaration cites a source: a key into CITATIONS, or the citation itself written inline
 * (so that a method from a new paper is declared in one file; the same fields, DOI only when certain).
 */
export type Cite = CitationKey | Citation;

export const citationOf = (cite: Cite): Citation => (typeof cite === 'string' ? CITATIONS[cite] : cite);

/** The citations of a list of keys or inline citations. */
export const citationsOf = (cites: readonly Cite[]): Citation[] => cites.map(citationOf);

/** "Kroupa 2001; Press et al. 1992" */
export const shortCitations = (cites: readonly Cite[]): string => cites.map((c) => citationOf(c).short).join('; ');

/** "Kroupa, P. 2001, MNRAS, 322, 231; …" (the free-text form stored in a result's methods list). */
export const fullCitations = (cites: readonly Cite[]): string => cites.map((c) => citationOf(c).full).join('; ');

/**
 * The DOI of a citation given in its full or short form, when it is known: among CITATIONS and
 * the `known` citations (method-choices.ts passes the ones its declarations write inline).
 */
export function doiAmong(reference: string, known: readonly Citation[]): string | undefined {
  const text = reference.trim();
  return [...Object.values(CITATIONS as Record<string, Citation>), ...known].find((c) => text.startsWith(c.full) || text === c.short)?.doi;
}

/** https://doi.org/<doi>: a plain link, never fetched by the app. */
export const doiUrl = (doi: string): string => `https://doi.org/${doi}`;
