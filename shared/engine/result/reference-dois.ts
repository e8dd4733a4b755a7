/**
 * DOIs of the references the methods declarations (methods.ts) cite, keyed by the start of the
 * citation string ("Surname, Initials Year"). Only DOIs known for certain are listed; a reference
 * missing here (older journals without DOIs, books, software, or a DOI not known for certain) is
 * exported without one. None is guessed: each DOI's journal, volume and first page agree with the
 * citation beside it.
 */
export const REFERENCE_DOIS: readonly { citation: string; doi: string }[] = [
  { citation: 'Salpeter, E. E. 1955', doi: '10.1086/145971' },
  { citation: 'Kroupa, P. 2001', doi: '10.1046/j.1365-8711.2001.04022.x' },
  { citation: 'Chabrier, G. 2003', doi: '10.1086/376392' },
  { citation: 'Kalirai, J. S., Hansen, B. M. S., Kelson, D. D., et al. 2008', doi: '10.1086/527028' },
  { citation: 'Cummings, J. D., Kalirai, J. S., Tremblay, P.-E., Ramirez-Ruiz, E. & Choi, J. 2018', doi: '10.3847/1538-4357/aadfd6' },
  { citation: 'Cumming, A., Butler, R. P., Marcy, G. W., et al. 2008', doi: '10.1086/588487' },
  { citation: 'Raghavan, D., McAlister, H. A., Henry, T. J., et al. 2010', doi: '10.1088/0067-0049/190/1/1' },
  { citation: 'Wichura, M. J. 1988', doi: '10.2307/2347330' },
  { citation: 'Jeans, J. H. 1924', doi: '10.1093/mnras/85.1.2' },
  { citation: 'Hurley, J. R., Pols, O. R. & Tout, C. A. 2000', doi: '10.1046/j.1365-8711.2000.03426.x' },
  { citation: 'Villaver, E. & Livio, M. 2009', doi: '10.1088/0004-637X/705/1/L81' },
  { citation: 'Mustill, A. J. & Villaver, E. 2012', doi: '10.1088/0004-637X/761/2/121' },
  { citation: 'Webbink, R. F. 1984', doi: '10.1086/161701' },
  { citation: 'de Kool, M. 1990', doi: '10.1086/168974' },
  { citation: 'Eggleton, P. P. 1983', doi: '10.1086/160960' },
  { citation: 'Rees, M. J. 1988', doi: '10.1038/333523a0' },
  { citation: 'Nauenberg, M. 1972', doi: '10.1086/151568' },
  { citation: 'Chabrier, G. & Baraffe, I. 2000', doi: '10.1146/annurev.astro.38.1.337' },
  { citation: 'Ferrario, L., de Martino, D. & Gänsicke, B. T. 2015', doi: '10.1007/s11214-015-0152-0' },
  { citation: 'Wickramasinghe, D. T. & Ferrario, L. 2005', doi: '10.1111/j.1365-2966.2004.08603.x' },
  { citation: 'Mestel, L. 1952', doi: '10.1093/mnras/112.6.583' },
  { citation: 'Schmidt, M. 1968', doi: '10.1086/149446' },
  { citation: 'Clopper, C. J. & Pearson, E. S. 1934', doi: '10.1093/biomet/26.4.404' },
  { citation: 'Kippenhahn, R., Weigert, A. & Weiss, A. 2012', doi: '10.1007/978-3-642-30304-3' },
];

/** The DOI of one citation string, when it is known. */
export function doiOf(reference: string): string | undefined {
  return REFERENCE_DOIS.find((d) => reference.startsWith(d.citation))?.doi;
}
