/**
 * Astronomers' formats: a run's tables as ECSV and VOTable, read back by astropy (Debian's
 * python3-astropy, an independent general astronomy table library) and checked against the
 * JSON result; the VOTable validated against the IVOA VOTable 1.4 schema with xmllint; the
 * BibTeX of the run's references.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureAstropy } from '../../scripts/astropy.ts';
import { toEcsv } from '../../server/modules/exports/ecsv.ts';
import type { ExportProvenance } from '../../server/modules/exports/export-table.ts';
import { runTables, type RunTableResult } from '../../server/modules/exports/run-tables.ts';
import { toVotable } from '../../server/modules/exports/votable.ts';
import type { ScenarioResult } from '../../shared/contracts/result.ts';
import { column, readWithAstropy, validateVotable } from '../support/astropy.ts';
import { checkScenario, createScenario, waitForRun } from '../support/runs.ts';
import { createTestApp, signUp, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
let owner: Awaited<ReturnType<typeof signUp>>;
let runId: string;
let result: ScenarioResult;

const text = (res: { text: string }) => res.text;

beforeAll(async () => {
  ensureAstropy();
  ctx = await createTestApp();
  owner = await signUp(ctx.app);
  const scenarioId = await createScenario(owner.agent, checkScenario({ systems: 20_000, seed: 'exports-1' }));
  runId = (await owner.agent.post('/api/runs').send({ scenarioId }).expect(201)).body.id;
  await waitForRun(owner.agent, runId);
  result = (await owner.agent.get(`/api/runs/${runId}/result`).expect(200)).body;
}, 180_000);
afterAll(() => ctx?.close());

describe('run table exports', () => {
  it('lists the tables an engine-2 result holds, each with its columns and units', async () => {
    const res = await owner.agent.get(`/api/runs/${runId}/export`).expect(200);
    const names = res.body.tables.map((t: { name: string }) => t.name);
    expect(names).toEqual(['wd-mass', 'wd-mass-by-setting', 'field', 'cooling-age', 'post-ce-period', 'survivor-separation', 'fate-map', 'fractions-by-setting', 'fractions-by-channel', 'companion-fates']);
    expect(res.body.formats.map((f: { format: string }) => f.format)).toEqual(['ecsv', 'votable']);
    const wdMass = res.body.tables[0];
    expect(wdMass.rows).toBe(result.bins.wdMass.magnetic.length);
    expect(wdMass.columns[0]).toMatchObject({ name: 'mass_lo', unit: 'solMass' });
  });

  it("gives the JSON result's white-dwarf mass table, with units, to astropy from ECSV and from VOTable", async () => {
    const { edgesMsun, magnetic, nonMagnetic } = result.bins.wdMass;
    expect(magnetic.reduce((a, b) => a + b, 0) + nonMagnetic.reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
    for (const format of ['ecsv', 'votable'] as const) {
      const res = await owner.agent.get(`/api/runs/${runId}/export?format=${format}&table=wd-mass`).buffer(true).parse((r, cb) => {
        let body = '';
        r.setEncoding('utf8');
        r.on('data', (c: string) => (body += c));
        r.on('end', () => cb(null, body));
      }).expect(200);
      expect(res.headers['content-disposition']).toContain(`tidefield-run-${runId}-wd-mass.${format === 'ecsv' ? 'ecsv' : 'vot'}`);
      const table = readWithAstropy(res.body as string, format);
      expect(table.rows).toBe(magnetic.length);
      // Same numbers as the JSON document: bin bounds exactly (shortest round-trip decimals), counts exactly.
      expect(column(table, 'mass_lo').values).toEqual(edgesMsun.slice(0, -1));
      expect(column(table, 'mass_hi').values).toEqual(edgesMsun.slice(1));
      expect(column(table, 'magnetic').values).toEqual(magnetic);
      expect(column(table, 'non_magnetic').values).toEqual(nonMagnetic);
      // Units attached, as astropy understands them (solar masses are a mass).
      expect(column(table, 'mass_lo').unit).toBe('solMass');
      expect(column(table, 'mass_lo').physical_type).toBe('mass');
      expect(column(table, 'magnetic').dtype).toBe('int64');
    }
  });

  it('carries the provenance in the ECSV meta and as VOTable INFO elements, and the VOTable passes the IVOA 1.4 schema', async () => {
    const ecsv = text(await owner.agent.get(`/api/runs/${runId}/export?format=ecsv&table=field`).expect(200));
    expect(ecsv.startsWith('# %ECSV 1.0\n# ---\n')).toBe(true);
    const table = readWithAstropy(ecsv, 'ecsv');
    expect(table.meta).toMatchObject({ engine_version: result.engineVersion, scenario_hash: result.scenarioHash, seed: 'exports-1', systems: 20_000, object: 'run', id: runId });
    expect((table.meta.scenario as { seed: string }).seed).toBe('exports-1');
    expect(table.meta.references).toContain('Webbink, R. F. 1984, ApJ, 277, 355');
    // MG: astropy's spelling of megagauss, a magnetic flux density.
    expect(column(table, 'field_lo').unit).toBe('MG');
    expect(column(table, 'field_lo').physical_type).toBe('magnetic flux density');
    // Bounds are 10^edge of the JSON's log10 edges; 1e-12 relative covers one rounding of the power.
    column(table, 'field_lo').values.forEach((v, i) => expect(v as number).toBeCloseTo(10 ** result.bins.logField.edgesLog10MG[i], 12));
    expect(column(table, 'count').values).toEqual(result.bins.logField.counts);

    for (const name of ['wd-mass', 'wd-mass-by-setting', 'field', 'cooling-age', 'post-ce-period', 'fate-map', 'fractions-by-setting', 'companion-fates', 'survivor-separation', 'fractions-by-channel']) {
      const vot = text(await owner.agent.get(`/api/runs/${runId}/export?format=votable&table=${name}`).buffer(true).expect(200));
      const verdict = validateVotable(vot);
      expect(verdict.output, name).toContain('validates');
      expect(verdict.ok).toBe(true);
    }
    const vot = text(await owner.agent.get(`/api/runs/${runId}/export?format=votable&table=fractions-by-setting`).buffer(true).expect(200));
    expect(vot).toContain(`<INFO name="scenario_hash" value="${result.scenarioHash}"/>`);
    const fractions = readWithAstropy(vot, 'votable');
    expect(column(fractions, 'setting').values).toEqual(['all', 'single', 'wide', 'postCE']);
    expect(column(fractions, 'fraction').values[0]).toBe(result.fraction.value);
    expect(column(fractions, 'fraction_se').values[0]).toBe(result.fraction.se);
  });

  it('names the field, the value and the allowed values on a bad request', async () => {
    const noTable = await owner.agent.get(`/api/runs/${runId}/export?format=ecsv`).expect(400);
    expect(noTable.body.error).toMatchObject({ field: 'table' });
    expect(noTable.body.error.message).toContain('wd-mass');
    const unknown = await owner.agent.get(`/api/runs/${runId}/export?format=ecsv&table=marginals`).expect(400);
    expect(unknown.body.error.message).toMatch(/table must be one of .*wd-mass.* \(got "marginals"\)/);
    const badFormat = await owner.agent.get(`/api/runs/${runId}/export?format=fits&table=wd-mass`).expect(400);
    expect(badFormat.body.error.message).toContain('ecsv, votable');
  });
});

describe('engine-2 result shapes', () => {
  // The bins engine 2 adds (shared/contracts/result.ts after issue 12), laid over a real engine-1
  // result: every new table appears, and astropy reads each with its unit.
  const provenance: ExportProvenance = { kind: 'run', id: 'engine2', engineVersion: '2.0.0', scenarioHash: 'a'.repeat(64), seed: 's', systems: 10, scenario: {}, references: [] };
  const split = (n: number, base: number) => ({ magnetic: Array.from({ length: n }, (_, i) => base + i), nonMagnetic: Array.from({ length: n }, (_, i) => 2 * base + i) });

  it('derives the cooling-age, post-CE period, mass-by-setting and per-channel field tables', () => {
    const engine2 = structuredClone(result) as unknown as RunTableResult;
    const coolingEdges = [-3, -2, -1, 0, Math.log10(14)];
    engine2.bins.coolingAge = { edgesLog10Gyr: coolingEdges, ...split(4, 3) };
    engine2.bins.postCommonEnvelopePeriod = { edgesLog10Days: [-2, 0, 2, 4], ...split(3, 5) };
    engine2.bins.wdMassBySetting = { edgesMsun: [0.2, 0.6, 1.0], single: split(2, 1), wide: split(2, 7), postCE: split(2, 9) };
    const fieldBins = engine2.bins.logField!.counts.length;
    engine2.bins.logField!.byChannel = { disruption: Array(fieldBins).fill(1), closeSurvivor: Array(fieldBins).fill(2), fossil: Array(fieldBins).fill(0) };
    engine2.counts.companionFates = { wide: 4, postCE: 3, disrupted: 2, dissolved: 1 };
    engine2.counts.heliumWhiteDwarfs = 7;

    const names = runTables.available(engine2).map((t) => t.name);
    expect(names).toEqual(expect.arrayContaining(['cooling-age', 'post-ce-period', 'wd-mass-by-setting']));

    const age = readWithAstropy(toEcsv(runTables.build('cooling-age', engine2)!, provenance), 'ecsv');
    expect(column(age, 'age_lo').unit).toBe('Gyr');
    expect(column(age, 'age_hi').values[3] as number).toBeCloseTo(14, 12);
    expect(column(age, 'magnetic').values).toEqual([3, 4, 5, 6]);

    const period = readWithAstropy(toVotable(runTables.build('post-ce-period', engine2)!, provenance), 'votable');
    expect(column(period, 'period_lo').unit).toBe('d');
    expect(column(period, 'period_lo').values).toEqual([0.01, 1, 100]);
    expect(column(period, 'non_magnetic').values).toEqual([10, 11, 12]);

    const bySetting = readWithAstropy(toEcsv(runTables.build('wd-mass-by-setting', engine2)!, provenance), 'ecsv');
    expect(Object.keys(bySetting.columns)).toEqual(['mass_lo', 'mass_hi', 'single_magnetic', 'single_non_magnetic', 'wide_magnetic', 'wide_non_magnetic', 'post_ce_magnetic', 'post_ce_non_magnetic']);
    expect(column(bySetting, 'post_ce_magnetic').values).toEqual([9, 10]);

    const field = readWithAstropy(toEcsv(runTables.build('field', engine2)!, provenance), 'ecsv');
    expect(Object.keys(field.columns)).toEqual(['field_lo', 'field_hi', 'count', 'disruption', 'close_survivor', 'fossil']);

    const fates = runTables.build('companion-fates', engine2)!;
    expect(fates.rows).toEqual([['wide', 4], ['postCE', 3], ['disrupted', 2], ['dissolved', 1]]);
    const fatesVot = toVotable(fates, provenance);
    expect(validateVotable(fatesVot).ok).toBe(true);
    expect(fatesVot).toContain('name="helium_white_dwarfs" datatype="long" value="7"');
  });
});

describe('references.bib', () => {
  it('gives one BibTeX entry per published reference of the methods, with the DOIs known for them', async () => {
    const res = await owner.agent.get(`/api/runs/${runId}/references.bib`).buffer(true).expect(200);
    expect(res.headers['content-type']).toContain('application/x-bibtex');
    const bib = res.text;
    // DOIs as registered by the publishers (Jeans 1924 MNRAS 85, 2; Eggleton 1983 ApJ 268, 368; Webbink 1984 ApJ 277, 355).
    expect(bib).toMatch(/@article\{Jeans1924,[^@]*doi = \{10\.1093\/mnras\/85\.1\.2\}/);
    expect(bib).toMatch(/@article\{Eggleton1983,[^@]*doi = \{10\.1086\/160960\}/);
    expect(bib).toMatch(/@article\{Webbink1984,[^@]*journal = \{ApJ\},\s*volume = \{277\},\s*pages = \{355\}/);
    // Every distinct reference with a year in the methods list has exactly one entry.
    const published = new Set(result.methods.flatMap((m) => m.reference.split('; ')).filter((r) => /\d{4}, /.test(r)));
    expect(bib.match(/^@\w+\{/gm)?.length).toBe(published.size);
    const keys = [...bib.matchAll(/^@\w+\{([^,]+),/gm)].map((m) => m[1]);
    expect(new Set(keys).size).toBe(keys.length);
  });
});

describe('sweep exports', () => {
  it("exports a sweep's curve with the swept parameter and the fractions", async () => {
    const scenarioId = await createScenario(owner.agent, checkScenario({ systems: 5000, seed: 'sweep-exports' }));
    const sweepId = (await owner.agent.post('/api/sweeps').send({ scenarioId, axes: [{ path: 'giant.reachAU', values: [1, 3] }] }).expect(201)).body.id;
    const sweep = await (async () => {
      for (let i = 0; i < 600; i++) {
        const res = await owner.agent.get(`/api/sweeps/${sweepId}`).expect(200);
        if (res.body.status === 'finished') return res.body;
        await new Promise((r) => setTimeout(r, 100));
      }
      throw new Error('sweep did not finish');
    })();
    const listing = await owner.agent.get(`/api/sweeps/${sweepId}/export`).expect(200);
    expect(listing.body.tables.map((t: { name: string }) => t.name)).toEqual(['curve']);
    const ecsv = text(await owner.agent.get(`/api/sweeps/${sweepId}/export?format=ecsv&table=curve`).expect(200));
    const table = readWithAstropy(ecsv, 'ecsv');
    expect(column(table, 'giant_reachAU').unit).toBe('AU');
    expect(column(table, 'giant_reachAU').values).toEqual([1, 3]);
    expect(column(table, 'fraction').values).toEqual(sweep.points.map((p: { fraction: number }) => p.fraction));
    expect(column(table, 'magnetic').values).toEqual(sweep.points.map((p: { magnetic: number }) => p.magnetic));
    const vot = text(await owner.agent.get(`/api/sweeps/${sweepId}/export?format=votable&table=curve`).buffer(true).expect(200));
    expect(validateVotable(vot).ok).toBe(true);
  }, 120_000);
});
