import type { MethodEntry } from '../../contracts/result.ts';
import type { Scenario } from '../../contracts/scenario.ts';

const REF = {
  salpeter: 'Salpeter, E. E. 1955, ApJ, 121, 161',
  kroupa: 'Kroupa, P. 2001, MNRAS, 322, 231',
  chabrier: 'Chabrier, G. 2003, PASP, 115, 763',
  press: 'Press, W. H., Teukolsky, S. A., Vetterling, W. T. & Flannery, B. P. 1992, Numerical Recipes, 2nd ed. (Cambridge University Press), §7.2',
  kippenhahn: 'Kippenhahn, R., Weigert, A. & Weiss, A. 2012, Stellar Structure and Evolution, 2nd ed. (Springer)',
  kalirai: 'Kalirai, J. S., Hansen, B. M. S., Kelson, D. D., et al. 2008, ApJ, 676, 594',
  cummings: 'Cummings, J. D., Kalirai, J. S., Tremblay, P.-E., Ramirez-Ruiz, E. & Choi, J. 2018, ApJ, 866, 21',
  cumming: 'Cumming, A., Butler, R. P., Marcy, G. W., et al. 2008, PASP, 120, 531',
  raghavan: 'Raghavan, D., McAlister, H. A., Henry, T. J., et al. 2010, ApJS, 190, 1',
  duquennoy: 'Duquennoy, A. & Mayor, M. 1991, A&A, 248, 485',
  wichura: 'Wichura, M. J. 1988, Applied Statistics, 37, 477 (algorithm AS 241)',
  brent: 'Brent, R. P. 2007, ANZIAM Journal, 48, C188 (xorgens); seedrandom xor4096 implementation',
  kepler: "Kepler's third law with the IAU 1976 Gaussian gravitational constant",
  jeans: 'Jeans, J. H. 1924, MNRAS, 85, 2',
  hurley: 'Hurley, J. R., Pols, O. R. & Tout, C. A. 2000, MNRAS, 315, 543',
  reimers: 'Reimers, D. 1975, Mém. Soc. R. Sci. Liège, 8, 369',
  mcdonald: 'McDonald, I. & Zijlstra, A. A. 2015, MNRAS, 448, 502',
  bloecker: 'Blöcker, T. 1995, A&A, 297, 727',
  paczynski: 'Paczyński, B. 1970, Acta Astronomica, 20, 47',
  zahn: 'Zahn, J.-P. 1977, A&A, 57, 383',
  villaver: 'Villaver, E. & Livio, M. 2009, ApJ, 705, L81',
  mustill: 'Mustill, A. J. & Villaver, E. 2012, ApJ, 761, 121',
  webbink: 'Webbink, R. F. 1984, ApJ, 277, 355',
  dekool: 'de Kool, M. 1990, ApJ, 358, 189',
  eggleton: 'Eggleton, P. P. 1983, ApJ, 268, 368',
  rees: 'Rees, M. J. 1988, Nature, 333, 523',
  ryu: 'Ryu, T., Krolik, J., Piran, T. & Noble, S. C. 2020, ApJ, 904, 98',
  nauenberg: 'Nauenberg, M. 1972, ApJ, 175, 417',
  chabrierBaraffe: 'Chabrier, G. & Baraffe, I. 2000, ARA&A, 38, 337',
  demircan: 'Demircan, O. & Kahraman, G. 1991, Ap&SS, 181, 313',
  ferrario: 'Ferrario, L., de Martino, D. & Gänsicke, B. T. 2015, Space Sci. Rev., 191, 111',
  fkr: 'Frank, J., King, A. & Raine, D. 2002, Accretion Power in Astrophysics, 3rd ed. (Cambridge University Press), chs. 5 and 6',
  shakura: 'Shakura, N. I. & Sunyaev, R. A. 1973, A&A, 24, 337',
  wickramasinghe: 'Wickramasinghe, D. T. & Ferrario, L. 2005, MNRAS, 356, 1576',
  mestel: 'Mestel, L. 1952, MNRAS, 112, 583',
  schmidt: 'Schmidt, M. 1968, ApJ, 151, 393',
  clopper: 'Clopper, C. J. & Pearson, E. S. 1934, Biometrika, 26, 404',
  tout: 'Tout, C. A., Wickramasinghe, D. T., Liebert, J., Ferrario, L. & Pringle, J. E. 2008, MNRAS, 387, 897',
  briggs: 'Briggs, G. P., Ferrario, L., Tout, C. A., Wickramasinghe, D. T. & Hurley, J. R. 2015, MNRAS, 447, 1713',
  nordhaus: 'Nordhaus, J., Wellons, S., Spiegel, D. S., Metzger, B. D. & Blackman, E. G. 2011, PNAS, 108, 3135',
  johnson: 'Johnson, J. A., Aller, K. M., Howard, A. W. & Crepp, J. R. 2010, PASP, 122, 905',
} as const;

/** Every published method the scenario uses, with its full reference (for a methods paragraph). */
export function methodsUsed(scenario: Scenario): MethodEntry[] {
  const out: MethodEntry[] = [];
  const add = (topic: string, method: string, reference: string) => out.push({ topic, method, reference });
  const p = scenario.primaries;

  const imf = p.imf;
  if (imf.law === 'salpeter1955') add('Initial mass function', 'Salpeter power law dN/dM ∝ M^-2.35, exact inverse-CDF sampling', `${REF.salpeter}; ${REF.press}`);
  else if (imf.law === 'kroupa2001') add('Initial mass function', 'Kroupa broken power law (slopes 0.3, 1.3, 2.3; breaks 0.08, 0.5 Msun), exact inverse-CDF sampling', `${REF.kroupa}; ${REF.press}`);
  else if (imf.law === 'chabrier2003') add('Initial mass function', 'Chabrier single-star IMF: log-normal below 1 Msun (tabulated CDF), power law above (exact inverse CDF)', `${REF.chabrier}, Table 1`);
  else if (imf.law === 'powerlaw') add('Initial mass function', `power law dN/dM ∝ M^-${imf.slope}, exact inverse-CDF sampling`, REF.press);
  else add('Initial mass function', `broken power law (slopes ${imf.slopes.join(', ')}; breaks ${imf.breaksMsun.join(', ')} Msun), exact inverse-CDF sampling`, REF.press);

  add('Star formation', p.history.kind === 'burst' ? `single burst ${p.history.ageGyr} Gyr ago` : `constant star formation over ${p.history.ageGyr} Gyr`, 'definition');
  if (p.lifetime.kind === 'scaling') add('Main-sequence lifetime', `t_MS = ${p.lifetime.t0Gyr} Gyr (M/Msun)^-${p.lifetime.exponent}`, REF.kippenhahn);
  else add('Main-sequence lifetime', `user table of ${p.lifetime.points.length} points, log-log interpolation`, 'user supplied');
  const ifmr = p.ifmr;
  if (ifmr.relation === 'kalirai2008') add('Initial–final mass relation', 'Mf = 0.109 Mi + 0.394 Msun', REF.kalirai);
  else if (ifmr.relation === 'cummings2018') add('Initial–final mass relation', `piecewise-linear, ${ifmr.calibration.toUpperCase()}-based`, REF.cummings);
  else add('Initial–final mass relation', `user table of ${ifmr.points.length} points, linear interpolation`, 'user supplied');

  const rows = scenario.companions.rows ?? [];
  if (rows.some((r) => r.shape.kind === 'powerlaw')) add('Companion distribution', 'power law in ln M and ln P (dN ∝ M^a P^b dlnM dlnP), exact inverse-CDF sampling', REF.cumming);
  if (rows.some((r) => r.shape.kind === 'lognormalPeriod')) add('Companion distribution', 'log-normal period distribution truncated to the row, flat in mass', `${REF.raghavan}; ${REF.duquennoy}`);
  rows.forEach((r, i) => {
    if (r.source) add(`Occurrence row ${i + 1}${r.label ? ` (${r.label})` : ''}`, `${r.class}, occurrence ${r.occurrence}`, r.source);
  });
  if (rows.some((r) => (r.hostMassSlope ?? 0) !== 0)) add('Companion occurrence', 'occurrence × (M1/Msun)^hostMassSlope, capped at 1 per star', REF.johnson);
  if (rows.some((r) => r.shape.kind === 'lognormalPeriod') || scenario.field.disruption.widthDex > 0 || scenario.channels.closeSurvivor || scenario.channels.fossil.enabled) {
    add('Random numbers', 'normal deviates by inversion (one uniform each)', REF.wichura);
  }
  add('Random numbers', 'seedrandom xor4096 generator seeded per chunk from (seed, chunk index)', REF.brent);
  add('Orbits', 'semi-major axis from the initial period and total mass', REF.kepler);
  add('Orbits', 'adiabatic widening under isotropic mass loss, a·M_total conserved', REF.jeans);

  if (scenario.giant.kind === 'fixedReach') {
    add('Engulfment', `engulfed iff the initial semi-major axis is below ${scenario.giant.reachAU} AU; common-envelope state: the final core and the full envelope at R = a0`, 'definition (transparent baseline)');
  } else {
    const g = scenario.giant;
    add('Giant track', 'analytic core-mass–luminosity relation and giant-branch radius', REF.hurley);
    add('Giant track', `asymptotic-giant-branch core-mass–luminosity relation L = 59250 (Mc − ${g.agbZeroPointMsun}) Lsun`, REF.paczynski);
    add('Mass loss', `Reimers wind with η = ${g.reimersEta}`, `${REF.reimers}; ${REF.mcdonald}`);
    if (g.superwind.kind === 'bloecker1995') add('Mass loss', `AGB superwind with η_B = ${g.superwind.eta}, timed so that the final core is the IFMR mass`, REF.bloecker);
    if (g.tide.kind === 'zahn1977') add('Tides', 'equilibrium tide on the companion orbit', `${REF.zahn}; ${REF.villaver}; ${REF.mustill}`);
    add('Common-envelope onset', 'the giant fills its Roche lobe towards the companion on the tidally decaying orbit', REF.eggleton);
    add('Common-envelope onset', 'critical separation a_crit(M1, M2) and the giant\'s state at the onset as a function of ln(a0/a_crit), tabulated per (M1, M2) node from direct integrations and interpolated', 'this engine (orbit integration on the track above)');
  }
  add('Common envelope', `energy formalism with the giant's state at the onset, α_CE = ${scenario.envelope.alpha}, λ = ${scenario.envelope.lambda}`, `${REF.webbink}; ${REF.dekool}`);
  add('Common envelope', 'survival requires the companion to fit its Roche lobe after the spiral-in; otherwise it is destroyed in the envelope (the common-envelope merger)', `${REF.eggleton}; ${REF.tout}; ${REF.briggs}; ${REF.nordhaus}`);
  if (scenario.disruption.dissolution.kind === 'belowMass') add('Companion destruction', `companions below ${scenario.disruption.dissolution.massMJup} MJup dissolve in the envelope (no disc, no field)`, 'assumption (user option)');
  add('White-dwarf radius', 'zero-temperature mass–radius relation, M_Ch = 1.44 Msun', REF.nauenberg);
  add('Companion radius', '1 Jupiter radius below 0.08 Msun; main-sequence power law above', `${REF.chabrierBaraffe}; ${REF.demircan}`);

  const f = scenario.field;
  if (scenario.channels.disruption) {
    const d = f.disruption;
    if (d.kind === 'lognormal') add('Field (disruption)', `log-normal, median ${d.medianMG} MG, ${d.widthDex} dex`, REF.ferrario);
    else if (d.kind === 'companionScaled') add('Field (disruption)', `B = ${d.referenceMG} MG · (M2 / ${d.referenceMassMJup} MJup)^${d.slope}, ${d.widthDex} dex log-normal scatter (an illustrative reading of the disc-dynamo trend, not a fit)`, REF.nordhaus);
    else {
      add('Field (disruption)', `magnetospheric radius r_A = (μ⁴/(2GMṀ²))^(1/7) at the stellar surface, Ṁ = disc mass / viscous time at the tidal radius (α = ${d.alpha}, H/R = ${d.aspectRatio})`, `${REF.fkr}; ${REF.shakura}`);
      add('Companion destruction', `disc radius = tidal radius r_t = ${scenario.disruption.eta} R2 (M_core/M2)^(1/3)`, `${REF.rees}; ${REF.ryu}`);
    }
  }
  if (scenario.channels.closeSurvivor) {
    const c = f.closeSurvivor;
    add('Field (close post-CE survivor)', `log-normal, median ${c.medianMG} MG, ${c.widthDex} dex, for final periods below ${c.maxPeriodDays} d`, REF.tout);
  }
  if (f.emergenceDelayGyr > 0) add('Field emergence', `companion-made fields count from a cooling age of ${f.emergenceDelayGyr} Gyr on`, 'assumption (user option)');
  if (scenario.channels.fossil.enabled) {
    add('Field (fossil)', 'magnetic flux conserved from the main sequence, B_WD = B_MS (R_MS/R_WD)²', REF.wickramasinghe);
    add('Main-sequence radius', 'power-law mass–radius relation', REF.demircan);
  }
  if (scenario.selection.kind === 'magnitudeLimited') {
    add('Selection', `magnitude-limited: acceptance ∝ F^(3/2), the visible volume, F the blackbody flux at ${scenario.selection.wavelengthNm} nm from the radius and effective temperature`, `${REF.schmidt}; ${REF.nauenberg}`);
    add('Selection', 'white-dwarf luminosity from Mestel cooling, L ∝ M t^(-7/5)', REF.mestel);
  }
  add('Statistics', 'fractions with binomial Monte Carlo standard errors √(f(1−f)/N)', 'common practice');
  if (scenario.observed) add('Statistics', 'exact two-sided binomial test and Clopper–Pearson intervals against the observed sample', REF.clopper);
  return out;
}
