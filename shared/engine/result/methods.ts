import type { MethodEntry } from '../../contracts/result.ts';
import type { Scenario } from '../../contracts/scenario.ts';
import { CITATIONS, fullCitations, type CitationKey } from '../../contracts/citations.ts';
import { IFMR_CHOICE, optionOf } from '../../contracts/method-choices.ts';

const REF = Object.fromEntries(Object.entries(CITATIONS).map(([k, c]) => [k, c.full])) as Record<CitationKey, string>;
const CLASS_WORDS = { planet: 'planets', brownDwarf: 'brown dwarfs', star: 'low-mass stars' } as const;
const KEPLER = "Kepler's third law with the IAU 1976 Gaussian gravitational constant";

/** Every published method the scenario uses, with its full reference (for a methods paragraph). */
export function methodsUsed(scenario: Scenario): MethodEntry[] {
  const out: MethodEntry[] = [];
  const add = (topic: string, method: string, reference: string) => out.push({ topic, method, reference });
  const p = scenario.primaries;

  // Engine 2.2 draws every distribution by table (numerics/quantile-table.ts, kernel/primary-table.ts).
  const sampling = 'inverse-CDF sampling by table (Kolmogorov distance ≤ 1e-7 to the exact distribution)';
  const imf = p.imf;
  if (imf.law === 'salpeter1955') add('Initial mass function', `Salpeter power law dN/dM ∝ M^-2.35, ${sampling}`, `${REF.salpeter}; ${REF.press}`);
  else if (imf.law === 'kroupa2001') add('Initial mass function', `Kroupa broken power law (slopes 0.3, 1.3, 2.3; breaks 0.08, 0.5 Msun), ${sampling}`, `${REF.kroupa}; ${REF.press}`);
  else if (imf.law === 'chabrier2003') add('Initial mass function', `Chabrier single-star IMF: log-normal below 1 Msun (tabulated CDF), power law above; ${sampling}`, `${REF.chabrier}, Table 1`);
  else if (imf.law === 'powerlaw') add('Initial mass function', `power law dN/dM ∝ M^-${imf.slope}, ${sampling}`, REF.press);
  else add('Initial mass function', `broken power law (slopes ${imf.slopes.join(', ')}; breaks ${imf.breaksMsun.join(', ')} Msun), ${sampling}`, REF.press);

  add('Star formation', p.history.kind === 'burst' ? `single burst ${p.history.ageGyr} Gyr ago` : `constant star formation over ${p.history.ageGyr} Gyr`, 'definition');
  add('White dwarfs drawn', 'the number of white dwarfs among each chunk\'s primaries is binomial with the white-dwarf probability; each white dwarf\'s mass and birth time are drawn from their distribution given t_MS < age (the same counts as drawing every primary and keeping the white dwarfs)', 'definition');
  if (p.lifetime.kind === 'scaling') add('Main-sequence lifetime', `t_MS = ${p.lifetime.t0Gyr} Gyr (M/Msun)^-${p.lifetime.exponent}`, REF.hansen);
  else add('Main-sequence lifetime', `user table of ${p.lifetime.points.length} points, log-log interpolation`, 'user supplied');
  const ifmr = p.ifmr;
  if (ifmr.relation === 'table') add('Initial–final mass relation', `user table of ${ifmr.points.length} points, linear interpolation`, 'user supplied');
  else {
    // A published relation: its words and sources as declared (shared/contracts/ifmr-relations.ts).
    const published = optionOf(IFMR_CHOICE, ifmr.relation)!;
    add('Initial–final mass relation', published.words(ifmr), fullCitations(published.cites));
  }

  const rows = scenario.companions.rows ?? [];
  if (rows.some((r) => r.shape.kind === 'powerlaw')) add('Companion distribution', `power law in ln M and ln P (dN ∝ M^a P^b dlnM dlnP), ${sampling}`, REF.cumming);
  if (rows.some((r) => r.shape.kind === 'lognormalPeriod')) add('Companion distribution', 'log-normal period distribution truncated to the row, flat in mass', `${REF.raghavan}; ${REF.duquennoy}`);
  rows.forEach((r, i) => {
    if (r.source) add(`Occurrence row ${i + 1}${r.label ? ` (${r.label})` : ''}`, `${CLASS_WORDS[r.class]}, occurrence ${r.occurrence}`, r.source);
  });
  if (rows.some((r) => (r.hostMassSlope ?? 0) !== 0)) add('Companion occurrence', 'occurrence × (M1/Msun)^(host-mass slope), capped at 1 per star', REF.johnson);
  if (rows.some((r) => r.shape.kind === 'lognormalPeriod') || scenario.field.disruption.widthDex > 0 || scenario.channels.closeSurvivor || scenario.channels.fossil.enabled) {
    add('Random numbers', 'normal deviates by inversion (one uniform each)', REF.wichura);
  }
  add('Random numbers', 'seedrandom xor4096 generator seeded per chunk from (seed, chunk index)', REF.brent);
  add('Orbits', 'semi-major axis from the initial period and total mass', KEPLER);
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
