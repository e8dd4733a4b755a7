import { CitationLinks } from '../../../components/ui/citation-links.tsx';
import { useBuilder } from './builder-context.tsx';
import { CheckboxField, DraftCheckbox, DraftKind, DraftNumber, DraftNumberList, DraftPoints, DraftRange, DraftSelect, DraftText, Reference } from './builder-fields.tsx';
import { BuilderSection, FieldGrid, SubGroup } from './builder-section.tsx';
import { getAt } from './scenario-draft.ts';
import {
  DISRUPTION_FIELD_CHOICE,
  DISSOLUTION_CHOICE,
  GIANT_CHOICE,
  HISTORY_CHOICE,
  IFMR_CHOICE,
  IMF_CHOICE,
  LIFETIME_CHOICE,
  optionOf,
  SELECTION_CHOICE,
  SUPERWIND_CHOICE,
  TIDE_CHOICE,
} from '../../../../shared/contracts/method-choices.ts';
import { CALIBRATION_OPTIONS } from '../../../../shared/contracts/ifmr-relations.ts';
import { chosenValue } from './scenario-options.ts';

/** Each section of the builder apart from the run and the companions: one published method per option, its source beside it. */

export function PrimariesSection() {
  const { doc } = useBuilder();
  const law = chosenValue(doc, IMF_CHOICE);
  const lifetime = chosenValue(doc, LIFETIME_CHOICE);
  const ifmr = chosenValue(doc, IFMR_CHOICE);
  return (
    <BuilderSection id="primaries" description="The stars that become white dwarfs: how their masses are drawn, when they formed, how long they live and what mass they end with.">
      <FieldGrid>
        <DraftKind choice={IMF_CHOICE} label="Initial mass function" />
        <DraftRange path={['primaries', 'massRangeMsun']} label="Initial masses drawn" unit="Msun" hint="Stars heavier than about 8 Msun do not end as white dwarfs." />
      </FieldGrid>
      {law === 'powerlaw' && (
        <FieldGrid>
          <DraftNumber path={['primaries', 'imf', 'slope']} label="Slope (dN/dM ∝ M^−slope)" unit="dimensionless" reference={<><CitationLinks cites={['salpeter']} /> found {String(optionOf(IMF_CHOICE, 'powerlaw')?.template.slope)}</>} />
        </FieldGrid>
      )}
      {law === 'brokenPowerlaw' && (
        <FieldGrid>
          <DraftNumberList path={['primaries', 'imf', 'breaksMsun']} label="Break masses" unit="Msun" hint="Ascending." />
          <DraftNumberList path={['primaries', 'imf', 'slopes']} label="Slopes, one per segment" unit="dimensionless" hint="One more than there are breaks." reference={<><CitationLinks cites={['kroupa']} />: {String(optionOf(IMF_CHOICE, 'brokenPowerlaw')?.template.slopes).replaceAll(',', ', ')}</>} />
        </FieldGrid>
      )}
      <FieldGrid>
        <DraftKind choice={HISTORY_CHOICE} label="Star-formation history" />
        <DraftNumber path={['primaries', 'history', 'ageGyr']} label="Age of the population" unit="Gyr" />
      </FieldGrid>
      <FieldGrid>
        <DraftKind choice={LIFETIME_CHOICE} label="Main-sequence lifetime" />
        {lifetime === 'scaling' && (
          <div className="grid gap-5 sm:grid-cols-2">
            <DraftNumber path={['primaries', 'lifetime', 't0Gyr']} label="Lifetime at 1 Msun, t0" unit="Gyr" />
            <DraftNumber path={['primaries', 'lifetime', 'exponent']} label="Exponent x" unit="dimensionless" />
          </div>
        )}
      </FieldGrid>
      {lifetime === 'table' && (
        <DraftPoints
          path={['primaries', 'lifetime', 'points']}
          label="Lifetime table"
          hint="Masses ascending, lifetimes falling; 2 to 200 points."
          columns={[
            { key: 'massMsun', label: 'Mass', unit: 'Msun' },
            { key: 'lifetimeGyr', label: 'Lifetime', unit: 'Gyr' },
          ]}
          newPoint={(last) => ({ massMsun: Number(last?.massMsun ?? 1) * 2, lifetimeGyr: Number(last?.lifetimeGyr ?? 10) / 5 })}
        />
      )}
      <FieldGrid>
        <DraftKind choice={IFMR_CHOICE} label="Initial–final mass relation (IFMR)" />
        {ifmr === 'cummings2018' && <DraftSelect path={['primaries', 'ifmr', 'calibration']} label="Calibration" options={CALIBRATION_OPTIONS} hint="The stellar models behind the fit." />}
      </FieldGrid>
      {ifmr === 'table' && (
        <DraftPoints
          path={['primaries', 'ifmr', 'points']}
          label="IFMR table"
          hint="Initial masses ascending; each final mass 0.1 to 1.4 Msun and below its initial mass; 2 to 200 points."
          columns={[
            { key: 'initialMsun', label: 'Initial mass', unit: 'Msun' },
            { key: 'finalMsun', label: 'Final mass', unit: 'Msun' },
          ]}
          newPoint={(last) => ({ initialMsun: Number(last?.initialMsun ?? 1) + 1, finalMsun: Number(last?.finalMsun ?? 0.5) + 0.1 })}
        />
      )}
    </BuilderSection>
  );
}

export function GiantSection() {
  const { doc } = useBuilder();
  const kind = chosenValue(doc, GIANT_CHOICE);
  const superwind = chosenValue(doc, SUPERWIND_CHOICE);
  return (
    <BuilderSection id="giant" description="When the primary swells into a giant: which companions it engulfs.">
      <DraftKind choice={GIANT_CHOICE} label="Engulfment model" />
      {kind === 'fixedReach' && (
        <FieldGrid>
          <DraftNumber path={['giant', 'reachAU']} label="Engulfment reach" unit="AU" hint="Companions with a smaller initial semi-major axis are engulfed." />
        </FieldGrid>
      )}
      {kind === 'track' && (
        <>
          <p className="text-sm text-foam-300">The track is for solar metallicity (Z = 0.02) and primaries of 0.8–8 Msun; it ends when the core reaches the IFMR’s final mass.</p>
          <FieldGrid>
            <DraftNumber
              path={['giant', 'reimersEta']}
              label="Reimers mass-loss efficiency η_R"
              unit="dimensionless"
              hint="On the red-giant branch and the AGB."
              reference="Reimers 1975; 0.477 ± 0.070 from McDonald & Zijlstra 2015"
            />
          </FieldGrid>
          <FieldGrid>
            <DraftNumber
              path={['giant', 'agbZeroPointMsun']}
              label="AGB zero point Mc0 of L = 59250 (Mc − Mc0)"
              unit="Msun"
              hint="0.522 as usually quoted; 0.495 in a later recalibration (both from memory)."
              reference="Paczyński 1970, Acta Astron. 20, 47"
            />
          </FieldGrid>
          <FieldGrid>
            <DraftKind choice={SUPERWIND_CHOICE} label="Late-AGB superwind" />
            {superwind === 'bloecker1995' && (
              <DraftNumber
                path={['giant', 'superwind', 'eta']}
                label="Superwind efficiency η_B"
                unit="dimensionless"
                hint="Where the wind would empty the envelope before the core reaches the IFMR mass, it is scaled down at that primary mass so that the track ends at the IFMR mass."
              />
            )}
          </FieldGrid>
          <DraftKind choice={TIDE_CHOICE} label="Tide on the companion’s orbit" />
        </>
      )}
    </BuilderSection>
  );
}

export function EnvelopeSection() {
  return (
    <BuilderSection
      id="envelope"
      description="An engulfed companion spirals in; if the orbital energy it releases can unbind the envelope, it survives on a short orbit."
    >
      <FieldGrid>
        <DraftNumber path={['envelope', 'alpha']} label="Efficiency α_CE" unit="dimensionless" hint="Share of the released orbital energy that goes into unbinding the envelope." reference="Webbink 1984, ApJ 277, 355" />
        <DraftNumber path={['envelope', 'lambda']} label="Envelope structure λ" unit="dimensionless" hint="In E_bind = G M M_env / (λ R)." reference="de Kool 1990, ApJ 358, 189" />
      </FieldGrid>
      <p className="text-sm text-foam-300">
        The budget uses the giant at the onset of the common envelope: for the track, when it fills its Roche lobe towards the companion; for the fixed reach, the final core and the
        full envelope at R = a0. A survivor must fit inside its Roche lobe after the envelope is gone, or it is destroyed in the envelope.
        <Reference>Roche-lobe radius from <CitationLinks cites={['eggleton']} /></Reference>
      </p>
    </BuilderSection>
  );
}

export function DisruptionSection() {
  const { doc } = useBuilder();
  const fieldKind = chosenValue(doc, DISRUPTION_FIELD_CHOICE);
  const dissolution = chosenValue(doc, DISSOLUTION_CHOICE);
  return (
    <BuilderSection
      id="disruption"
      description="A companion that cannot eject the envelope spirals in and is shredded near the core (the common-envelope merger); its debris disc makes the field of the disruption channel. The star then goes on to its IFMR mass."
    >
      <FieldGrid>
        <DraftNumber
          path={['disruption', 'eta']}
          label="Tidal-radius factor η"
          unit="dimensionless"
          hint={
            fieldKind === 'accretion'
              ? 'In r_t = η R2 (M_core/M2)^(1/3), the radius of the debris disc: 2.44 is the fluid Roche limit, about 1 suits stars.'
              : 'Has no effect with the current field prescription: only the accretion field uses η (for the disc’s radius).'
          }
          reference="Rees 1988, Nature 333, 523; Ryu et al. 2020, ApJ 904, 98"
        />
      </FieldGrid>
      <FieldGrid>
        <DraftKind choice={DISSOLUTION_CHOICE} label="Dissolution in the envelope" />
        {dissolution === 'belowMass' && (
          <DraftNumber path={['disruption', 'dissolution', 'massMJup']} label="Companions lighter than this dissolve" unit="MJup" hint="No disc and no field for them." />
        )}
      </FieldGrid>
      <p className="text-sm text-foam-300">
        Companion radii: one Jupiter radius below 0.08 Msun, a main-sequence power law above; the white dwarf’s radius from its mass.
        <Reference><CitationLinks cites={['chabrierBaraffe', 'demircan', 'nauenberg']} /></Reference>
      </p>
    </BuilderSection>
  );
}

export function FieldSection() {
  const { doc } = useBuilder();
  const kind = chosenValue(doc, DISRUPTION_FIELD_CHOICE);
  const disruptionOn = getAt(doc, ['channels', 'disruption']) !== false;
  const closeOn = getAt(doc, ['channels', 'closeSurvivor']) === true;
  return (
    <BuilderSection id="field" description="The field each magnetizing outcome leaves, and the weakest field that counts as magnetic.">
      <SubGroup
        title="After a companion is destroyed in the envelope"
        description={disruptionOn ? undefined : 'Has no effect while the disruption channel is off (Channels).'}
      >
        <DraftKind choice={DISRUPTION_FIELD_CHOICE} label="Field prescription" />
        {kind === 'companionScaled' && (
          <FieldGrid>
            <DraftNumber path={['field', 'disruption', 'referenceMG']} label="Median field at the reference mass" unit="MG" />
            <DraftNumber path={['field', 'disruption', 'referenceMassMJup']} label="Reference companion mass" unit="MJup" />
            <DraftNumber path={['field', 'disruption', 'slope']} label="Slope of log B against log M2" unit="dimensionless" />
            <DraftNumber path={['field', 'disruption', 'widthDex']} label="Scatter" unit="dex" />
          </FieldGrid>
        )}
        {kind === 'lognormal' && (
          <FieldGrid>
            <DraftNumber path={['field', 'disruption', 'medianMG']} label="Median field" unit="MG" />
            <DraftNumber path={['field', 'disruption', 'widthDex']} label="Width" unit="dex" />
          </FieldGrid>
        )}
        {kind === 'accretion' && (
          <FieldGrid>
            <DraftNumber path={['field', 'disruption', 'alpha']} label="Disc viscosity α" unit="dimensionless" reference="Shakura & Sunyaev 1973, A&A 24, 337" />
            <DraftNumber path={['field', 'disruption', 'aspectRatio']} label="Disc aspect ratio H/R" unit="dimensionless" />
            <DraftNumber path={['field', 'disruption', 'discMassFraction']} label="Share of the companion in the disc" unit="fraction" />
            <DraftNumber path={['field', 'disruption', 'widthDex']} label="Scatter around the computed field" unit="dex" hint="0 for none." />
          </FieldGrid>
        )}
      </SubGroup>
      <SubGroup
        title="Close post-common-envelope survivors"
        description={
          closeOn
            ? <Reference>The near-merger case of <CitationLinks cites={['tout']} /></Reference>
            : 'Has no effect while the close-survivor channel is off (Channels).'
        }
      >
        <FieldGrid>
          <DraftNumber path={['field', 'closeSurvivor', 'medianMG']} label="Median field" unit="MG" />
          <DraftNumber path={['field', 'closeSurvivor', 'widthDex']} label="Width" unit="dex" />
          <DraftNumber path={['field', 'closeSurvivor', 'maxPeriodDays']} label="Only for final periods below" unit="days" />
        </FieldGrid>
      </SubGroup>
      <FieldGrid>
        <DraftNumber
          path={['field', 'emergenceDelayGyr']}
          label="Field emerges after a cooling age of"
          unit="Gyr"
          hint="Fields made by companions count only once the white dwarf is this old; 0 = at once. Fossil fields are not delayed."
        />
        <DraftNumber path={['field', 'thresholdMG']} label="Detection threshold" unit="MG" hint="A white dwarf counts as magnetic from this field up; surveys reach about 1 MG." />
      </FieldGrid>
    </BuilderSection>
  );
}

export function ChannelsSection() {
  const { doc } = useBuilder();
  const fossilOn = getAt(doc, ['channels', 'fossil', 'enabled']) === true;
  return (
    <BuilderSection id="channels" description="Which outcomes make a magnetic white dwarf.">
      <div className="flex flex-col gap-4">
        <DraftCheckbox path={['channels', 'disruption']} label="Tidal disruption of a companion" hint="Its debris is accreted and the field follows the prescription above." />
        <DraftCheckbox
          path={['channels', 'closeSurvivor']}
          label="Close post-common-envelope survivors"
          hint="Survivors whose final period is below the limit set under Field get a field (off by default: no magnetic white dwarf is seen in detached post-common-envelope binaries)."
        />
        {(getAt(doc, ['channels', 'coreMerger']) !== undefined || getAt(doc, ['field', 'coreMerger']) !== undefined) && (
          <p className="text-sm text-foam-300">
            This scenario still carries engine-1 core-merger settings. Engine 2 has no such channel (a destroyed companion is the disruption channel) and ignores them; a run’s assumptions say so.
          </p>
        )}
        <DraftCheckbox
          path={['channels', 'fossil', 'enabled']}
          label="Fossil fields"
          hint="A share of progenitors carry a main-sequence field, kept by flux conservation: B_WD = B_MS (R_MS/R_WD)²."
        />
      </div>
      {fossilOn && (
        <SubGroup title="Fossil channel" description={<Reference><CitationLinks cites={['wickramasinghe']} /></Reference>}>
          <FieldGrid>
            <DraftNumber path={['channels', 'fossil', 'fraction']} label="Share of progenitors with a field" unit="fraction" />
            <DraftRange path={['channels', 'fossil', 'massRangeMsun']} label="Progenitor masses" unit="Msun" hint="Ap/Bp stars lie around 1.5–4 Msun." />
            <DraftNumber path={['channels', 'fossil', 'msField', 'medianKG']} label="Median main-sequence field" unit="kG" />
            <DraftNumber path={['channels', 'fossil', 'msField', 'widthDex']} label="Width" unit="dex" />
          </FieldGrid>
        </SubGroup>
      )}
    </BuilderSection>
  );
}

export function SelectionSection() {
  const { doc, update, readOnly } = useBuilder();
  const kind = chosenValue(doc, SELECTION_CHOICE);
  const observed = getAt(doc, ['observed']);
  return (
    <BuilderSection id="selection" description="Which white dwarfs a survey would see, and, if you like, the counts to test the prediction against.">
      <FieldGrid>
        <DraftKind choice={SELECTION_CHOICE} label="Sample" />
        {kind === 'magnitudeLimited' && (
          <DraftNumber path={['selection', 'coolingAgeFloorGyr']} label="Cooling-age floor" unit="Gyr" hint="Younger cooling ages are raised to it (Mestel’s law fails for hot white dwarfs)." />
        )}
        {kind === 'magnitudeLimited' && (
          <DraftNumber path={['selection', 'wavelengthNm']} label="Survey band wavelength" unit="nm" hint="The blackbody flux is taken here; the V band is about 550 nm." />
        )}
      </FieldGrid>
      <CheckboxField
        id="scenario-observed-toggle"
        label="Test against observed counts"
        hint="Kept with the scenario. Stored samples can also be chosen on a run’s page."
        checked={observed !== undefined}
        disabled={readOnly}
        onChange={(checked) => update(['observed'], checked ? { magnetic: 0, total: 100 } : undefined)}
      />
      {observed !== undefined && (
        <FieldGrid columns={3}>
          <DraftNumber path={['observed', 'magnetic']} label="Magnetic" unit="white dwarfs" grouping />
          <DraftNumber path={['observed', 'total']} label="Total" unit="white dwarfs" grouping />
          <DraftText path={['observed', 'label']} label="Where the counts come from" maxLength={200} />
        </FieldGrid>
      )}
    </BuilderSection>
  );
}

