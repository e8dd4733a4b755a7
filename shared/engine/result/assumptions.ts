import type { Scenario } from '../../contracts/scenario.ts';
import { formatNumber } from '../../contracts/field-issues.ts';
import { finalMassMsun, MAX_WHITE_DWARF_MSUN } from '../physics/ifmr-piecewise.ts';
import { ifmrSegments, lightestWhiteDwarfProgenitorMsun, preparedLifetime } from '../kernel/scenario-physics.ts';
import { BINS } from '../kernel/bins.ts';

/** Plain-language caveats a referee would want next to the numbers of this scenario. */
export function assumptionsFor(scenario: Scenario): string[] {
  const out: string[] = [];
  const p = scenario.primaries;
  out.push(
    `Monte Carlo: ${formatNumber(scenario.systems)} primaries drawn with seed "${scenario.seed}"; every fraction is a ratio of integer counts and carries a binomial Monte Carlo standard error. Rerunning with the same seed and engine version reproduces the counts exactly.`,
  );
  out.push(
    `A primary is a white dwarf today iff its main-sequence lifetime is shorter than its age; primaries are drawn in ${p.massRangeMsun[0]}–${p.massRangeMsun[1]} Msun (heavier stars are taken not to make white dwarfs). The time spent as a giant is neglected.`,
  );
  if (p.history.kind === 'constant') out.push(`Constant star formation: stellar ages are uniform on [0, ${p.history.ageGyr}] Gyr.`);

  const ifmr = ifmrSegments(scenario);
  const lightest = lightestWhiteDwarfProgenitorMsun(preparedLifetime(scenario), p.massRangeMsun, p.history.ageGyr);
  if (lightest !== null) {
    const [validLo, validHi] = ifmr.validMsun;
    const hi = p.massRangeMsun[1];
    if (lightest < validLo || hi > validHi) {
      out.push(
        `The IFMR is calibrated for initial masses ${validLo}–${validHi} Msun; it is extended linearly to the white-dwarf progenitors drawn here (${lightest.toFixed(2)}–${hi} Msun).`,
      );
    }
    if (finalMassMsun(ifmr, hi) >= MAX_WHITE_DWARF_MSUN) out.push(`White-dwarf masses are capped at ${MAX_WHITE_DWARF_MSUN} Msun, below the Chandrasekhar mass.`);
  }

  out.push(
    'Companions are on circular orbits and each one\'s fate is decided as if it were alone; a white dwarf\'s field is the largest among those of its destroyed companions (and its fossil field). Occurrence rows apply whatever the host\'s mass unless a row sets a host-mass slope (occurrence × (M1/Msun)^slope, capped at 1 per star).',
  );
  const rows = scenario.companions.rows ?? [];
  if (rows.some((r) => r.shape.kind === 'lognormalPeriod')) out.push('Rows with a log-normal period distribution are flat in the row\'s mass coordinate (mass ratio or mass).');
  if (rows.some((r) => r.massRatio)) out.push('Mass ratios are q = M2/M1 with the initial primary mass.');

  if (scenario.giant.kind === 'fixedReach') {
    out.push(
      `Fixed engulfment reach: a companion is engulfed iff its initial semi-major axis (Kepler's law with the initial total mass) is below ${scenario.giant.reachAU} AU. At the onset of the common envelope the giant's radius and the separation are set equal to that initial separation, its core to the final white-dwarf mass and its envelope to M1 − M_WD (all of it must be ejected): an assumption, not a stellar track. A post-common-envelope white dwarf has the IFMR mass.`,
    );
  } else {
    out.push(
      'Analytic giant track: the common envelope starts when the giant fills its Roche lobe towards the companion (Eggleton 1983) on the orbit widened by the wind and shrunk by the tide. The critical separation a_crit(M1, M2) and the giant\'s state at the onset (core mass, total mass, radius, separation) as a function of ln(a0/a_crit) are integrated on a grid of 24 primary × 16 companion masses × 64 separations (a_crit/400 to a_crit) and interpolated; masses outside the grid take its edge values. Where an orbit escaping the red-giant tip is caught on the AGB the onset state jumps; interpolation smears that jump over one separation sample (10% in a0).',
    );
    out.push(
      'A post-common-envelope white dwarf has the core mass at the onset: a helium white dwarf when the envelope is ejected on the red giant branch. A white dwarf whose companion was destroyed, or that has none, reaches its IFMR mass. With several companions, each one\'s fate is decided alone and the white dwarf takes the smallest onset core among its post-common-envelope companions.',
    );
    out.push(
      'The AGB wind is scaled down at a primary mass where it would otherwise empty the envelope before the core reaches the IFMR mass (the superwind is timed to end the track at the IFMR mass); the horizontal branch is skipped.',
    );
  }
  out.push('Surviving wide companions keep the adiabatically widened orbit (a·M_total conserved); no tides, drag or later interaction act on them after the giant phases.');
  out.push(
    'Common envelope: the orbital-energy change between the onset separation and the final one goes into unbinding the envelope with efficiency α_CE (Webbink 1984); a survivor must fit inside its Roche lobe and stay outside the core; post-common-envelope systems are not evolved further (no magnetic braking or gravitational-wave decay).',
  );
  out.push(
    'A companion that cannot eject the envelope is destroyed in it (the common-envelope merger): it spirals in and is tidally shredded near the core, whose debris disc makes the field of the disruption channel. The separate "merged with the core" outcome of engine 1 is removed: the tidal radius lies outside the core for every non-degenerate companion.',
  );
  if (scenario.disruption.dissolution.kind === 'belowMass') {
    out.push(`Companions lighter than ${scenario.disruption.dissolution.massMJup} MJup that cannot eject the envelope dissolve in it before reaching the core: no disc and no field (an assumption).`);
  }
  out.push(
    'Companion radii: one Jupiter radius below 0.08 Msun, the Demircan & Kahraman (1991) main-sequence power law above.',
  );
  out.push(
    'Fields: one standard-normal deviate per white dwarf scales every log-normal field of that white dwarf, so its channels are correlated; a white dwarf is magnetic iff its field is at least the threshold.',
  );
  if (scenario.field.disruption.kind === 'companionScaled') {
    out.push('Disruption field: the median grows as a power of the shredded companion\'s mass, an illustrative reading of the disc-dynamo trend (Nordhaus et al. 2011), not a fit.');
  }
  if (scenario.field.disruption.kind === 'accretion') {
    out.push('Accretion field: the debris disc forms at the tidal radius (η) around the core and drains in one viscous time; the field is the one whose magnetospheric radius sits at the stellar surface.');
  }
  if (scenario.channels.closeSurvivor) {
    out.push(`Close post-common-envelope survivors with a final period below ${scenario.field.closeSurvivor.maxPeriodDays} d carry a field (the near-merger case of Tout et al. 2008).`);
  }
  if (scenario.field.emergenceDelayGyr > 0) {
    out.push(`Fields made by companions count only once the cooling age exceeds ${scenario.field.emergenceDelayGyr} Gyr (a late-emerging field); fossil fields are there from the start. The giant phases are not counted in the cooling age.`);
  }
  if (scenario.field.coreMerger !== undefined || scenario.channels.coreMerger !== undefined) {
    out.push('The scenario document carries engine-1 settings for a core-merger field or channel; engine 2 has no core-merger channel and ignores them.');
  }
  if (scenario.channels.fossil.enabled) {
    const fossil = scenario.channels.fossil;
    out.push(
      `Fossil channel: ${fossil.fraction} of progenitors in ${fossil.massRangeMsun[0]}–${fossil.massRangeMsun[1]} Msun carry a log-normal main-sequence field (median ${fossil.msField.medianKG} kG, ${fossil.msField.widthDex} dex), kept by flux conservation to the white dwarf.`,
    );
  }
  if (scenario.selection.kind === 'magnitudeLimited') {
    out.push(
      `Magnitude-limited selection: each white dwarf is kept with probability ∝ F^(3/2) (visible volume of a homogeneous, dust-free space), F its blackbody flux at ${scenario.selection.wavelengthNm} nm from its Nauenberg radius and its effective temperature; the luminosity is Mestel's at the cooling age (age − t_MS) raised to at least ${scenario.selection.coolingAgeFloorGyr} Gyr, because Mestel's law fails for hot young white dwarfs. Massive white dwarfs are smaller and so fainter at young cooling ages; under Mestel cooling (L ∝ M at a given age) they are hotter, and beyond ≈ 0.5 Gyr their V-band flux exceeds that of a 0.6 Msun white dwarf of the same age. The multiplier response holds the selection at the run's multiplier.`,
    );
  }
  out.push(
    `Implied occurrence: a companion is present iff its presence uniform is below occurrence × multiplier, so one run gives the exact magnetic count at every multiplier on a ${BINS.multiplierBins}-bin grid over [0, 1/max occurrence] (common random numbers, no rerun); between grid edges the response is interpolated.`,
  );
  return out;
}
