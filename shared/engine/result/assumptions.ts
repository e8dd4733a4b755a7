import type { Scenario } from '../../contracts/scenario.ts';
import { formatNumber } from '../../contracts/schema-issues.ts';
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
    'Companions are on circular orbits and each one\'s fate is decided as if it were alone; a white dwarf\'s field is the largest among those of its destroyed companions (and its fossil field). Occurrence rows apply whatever the host\'s mass.',
  );
  const rows = scenario.companions.rows ?? [];
  if (rows.some((r) => r.shape.kind === 'lognormalPeriod')) out.push('Rows with a log-normal period distribution are flat in the row\'s mass coordinate (mass ratio or mass).');
  if (rows.some((r) => r.massRatio)) out.push('Mass ratios are q = M2/M1 with the initial primary mass.');

  if (scenario.giant.kind === 'fixedReach') {
    out.push(
      `fixedReach: a companion is engulfed iff its initial semi-major axis (Kepler's law with the initial total mass) is below ${scenario.giant.reachAU} AU. At engulfment the giant's radius is set equal to that separation, its core to the final white-dwarf mass and its envelope to M1 − M_WD (all of it must be ejected): an assumption, not a stellar track.`,
    );
  } else {
    out.push(
      'track: the engulfment boundary a_crit(M1, M2) is integrated on a grid of 24 primary × 16 companion masses and interpolated bilinearly in log masses; masses outside the grid take its edge values. The envelope that must be ejected is the giant\'s when its radius first reaches the companion\'s initial separation (clamped to the largest radius the track reaches).',
    );
    out.push('The white-dwarf mass is the IFMR\'s even when a common envelope is ejected before the core has finished growing.');
  }
  out.push('Surviving wide companions keep the adiabatically widened orbit (a·M_total conserved); no tides, drag or later interaction act on them.');
  out.push(
    'Common envelope: the whole orbital-energy change goes into unbinding the envelope with efficiency α_CE; a survivor must fit inside its Roche lobe and stay outside the core; post-common-envelope systems are not evolved further.',
  );
  out.push(
    'Companion radii: one Jupiter radius below 0.08 Msun, the Demircan & Kahraman (1991) main-sequence power law above. A destroyed companion counts as a core merger only if its tidal radius lies inside the core (white-dwarf radius), which dense enough companions alone reach.',
  );
  out.push(
    'Fields: one standard-normal deviate per white dwarf scales every log-normal field of that white dwarf, so its channels are correlated; a white dwarf is magnetic iff its field is at least the threshold.',
  );
  if (scenario.field.disruption.kind === 'accretion') {
    out.push('Accretion field: the debris disc forms at the tidal radius around the core and drains in one viscous time; the field is the one whose magnetospheric radius sits at the stellar surface.');
  }
  if (scenario.channels.fossil.enabled) {
    const fossil = scenario.channels.fossil;
    out.push(
      `Fossil channel: ${fossil.fraction} of progenitors in ${fossil.massRangeMsun[0]}–${fossil.massRangeMsun[1]} Msun carry a log-normal main-sequence field (median ${fossil.msField.medianKG} kG, ${fossil.msField.widthDex} dex), kept by flux conservation to the white dwarf.`,
    );
  }
  if (scenario.selection.kind === 'magnitudeLimited') {
    out.push(
      `Magnitude-limited selection: each white dwarf is kept with probability ∝ L^(3/2) (visible volume of a homogeneous, dust-free space, bolometric fluxes), L from Mestel cooling at the cooling age (age − t_MS) raised to at least ${scenario.selection.coolingAgeFloorGyr} Gyr, because Mestel's law fails for hot young white dwarfs and would give them unbounded weight.`,
    );
  }
  out.push(
    `Implied occurrence: a companion is present iff its presence uniform is below occurrence × multiplier, so one run gives the exact magnetic count at every multiplier on a ${BINS.multiplierBins}-bin grid over [0, 1/max occurrence] (common random numbers, no rerun); between grid edges the response is interpolated.`,
  );
  return out;
}
