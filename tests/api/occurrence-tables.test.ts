import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signUp, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
let owner: Awaited<ReturnType<typeof signUp>>;
beforeAll(async () => {
  ctx = await createTestApp();
  owner = await signUp(ctx.app);
});
afterAll(() => ctx.close());

const HEADER = 'class,massUnit,massMin,massMax,periodMinDays,periodMaxDays,occurrence,shape,massSlope,periodSlope,meanLog10PeriodDays,sigmaLog10Period,label,source,assumed';
const GOOD = [
  HEADER,
  'planet,MJup,0.3,10,2,2000,0.105,powerlaw,-0.31,0.26,,,Giant planets,"Cumming et al. 2008, PASP 120, 531",',
  'star,q,0.1,1,1,1e8,0.3,lognormalPeriod,,,5.03,2.28,M-dwarf companions,Raghavan et al. 2010,flat in q',
].join('\n');

const upload = (csv: string | Buffer, name = 'Uploaded') =>
  owner.agent.post('/api/occurrence-tables/upload').field('name', name).attach('file', Buffer.isBuffer(csv) ? csv : Buffer.from(csv), 'table.csv');

async function tableCount() {
  return (await owner.agent.get('/api/occurrence-tables').expect(200)).body.tables.length as number;
}

describe('occurrence table CSV', () => {
  it('stores a good file and downloads the same rows', async () => {
    const res = await upload(GOOD).expect(201);
    const table = await owner.agent.get(`/api/occurrence-tables/${res.body.id}`).expect(200);
    expect(table.body.rowCount).toBe(2);
    expect(table.body.rows[0]).toMatchObject({ class: 'planet', massMJup: [0.3, 10], occurrence: 0.105, shape: { kind: 'powerlaw', massSlope: -0.31 } });
    expect(table.body.rows[1]).toMatchObject({ massRatio: [0.1, 1], shape: { kind: 'lognormalPeriod', meanLog10PeriodDays: 5.03 } });
    const csv = await owner.agent.get(`/api/occurrence-tables/${res.body.id}/csv`).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const again = await upload(csv.text, 'Round trip').expect(201);
    const table2 = await owner.agent.get(`/api/occurrence-tables/${again.body.id}`).expect(200);
    expect(table2.body.rows).toEqual(table.body.rows);
  });

  it('reports a wrong header, naming the column, and stores nothing', async () => {
    const before = await tableCount();
    const res = await upload(GOOD.replace('occurrence', 'fraction')).expect(400);
    expect(res.body.error.code).toBe('csv_invalid');
    expect(res.body.error.details).toContainEqual(expect.objectContaining({ line: 1, column: 'occurrence' }));
    expect(res.body.error.details).toContainEqual(expect.objectContaining({ line: 1, column: 'fraction' }));
    expect(await tableCount()).toBe(before);
  });

  it('reports a non-numeric cell with its line and column', async () => {
    const before = await tableCount();
    const res = await upload(GOOD.replace('0.3,10,2,2000', '0.3,ten,2,2000')).expect(400);
    expect(res.body.error.details).toEqual([{ line: 2, column: 'massMax', message: 'massMax must be a number (got "ten")' }]);
    expect(await tableCount()).toBe(before);
  });

  it('reports an occurrence above 1', async () => {
    const res = await upload(GOOD.replace(',0.3,lognormal', ',1.3,lognormal')).expect(400);
    expect(res.body.error.details).toEqual([{ line: 3, column: 'occurrence', message: 'occurrence must be between 0 and 1 (got 1.3)' }]);
  });

  it('refuses 10,001 rows and accepts 10,000', async () => {
    const row = 'planet,MJup,1,2,10,100,0.0001,powerlaw,0,0,,,,,';
    const before = await tableCount();
    const tooMany = await upload([HEADER, ...Array(10_001).fill(row)].join('\n')).expect(400);
    expect(tooMany.body.error.message).toMatch(/10001 rows; a table holds at most 10000/);
    expect(await tableCount()).toBe(before);
    const ok = await upload([HEADER, ...Array(10_000).fill(row)].join('\n')).expect(201);
    const detail = await owner.agent.get(`/api/occurrence-tables/${ok.body.id}`).expect(200);
    expect(detail.body.rowCount).toBe(10_000);
  });

  it('refuses a 2 MB file with 413', async () => {
    const before = await tableCount();
    const res = await upload(Buffer.alloc(2 * 1024 * 1024, 'a')).expect(413);
    expect(res.body.error).toMatchObject({ code: 'file_too_large', field: 'file' });
    expect(await tableCount()).toBe(before);
  });

  it('previews without storing, and edits rows', async () => {
    const before = await tableCount();
    const preview = await owner.agent.post('/api/occurrence-tables/preview').attach('file', Buffer.from(GOOD), 'x.csv').expect(200);
    expect(preview.body).toMatchObject({ rowCount: 2, problems: [] });
    expect(await tableCount()).toBe(before);
    const created = await owner.agent.post('/api/occurrence-tables').send({ name: 'Edited', rows: preview.body.rows }).expect(201);
    const rows = preview.body.rows.slice(0, 1);
    rows[0].occurrence = 0.2;
    const edited = await owner.agent.patch(`/api/occurrence-tables/${created.body.id}`).send({ rows }).expect(200);
    expect(edited.body).toMatchObject({ rowCount: 1, rows: [{ occurrence: 0.2 }] });
    const bad = await owner.agent.patch(`/api/occurrence-tables/${created.body.id}`).send({ rows: [{ ...rows[0], occurrence: 2 }] }).expect(400);
    expect(bad.body.error.field).toBe('rows.0.occurrence');
    expect(bad.body.error.message).toBe('rows.0.occurrence must be between 0 and 1 (got 2)');
    expect((await owner.agent.get(`/api/occurrence-tables/${created.body.id}`).expect(200)).body.rows[0].occurrence).toBe(0.2);
  });
});

describe('CSV formula injection (issue 9, item 12)', () => {
  it('neutralises formula cells in a table download with a leading apostrophe, and leaves numbers alone', async () => {
    const hostile = [
      HEADER,
      'planet,MJup,0.3,10,2,2000,0.105,powerlaw,-0.31,0.26,,,=HYPERLINK("http://evil.example"),+cmd|calc,@SUM(1)',
      'planet,MJup,0.3,10,2,2000,0.1,powerlaw,-0.31,0.26,,,-2+3,-cmd,-1.5',
    ].join('\n');
    const res = await upload(hostile, 'Hostile').expect(201);
    const csv = (await owner.agent.get(`/api/occurrence-tables/${res.body.id}/csv`).expect(200)).text;
    const cells = csv.split('\n').slice(1, 3).map((line) => line.split(/,(?=(?:[^"]*"[^"]*")*[^"]*$)/));
    const column = (name: string) => HEADER.split(',').indexOf(name);
    expect(cells[0]![column('label')]).toBe(`"'=HYPERLINK(""http://evil.example"")"`);
    expect(cells[0]![column('source')]).toBe(`"'+cmd|calc"`);
    expect(cells[0]![column('assumed')]).toBe(`"'@SUM(1)"`);
    expect(cells[1]![column('label')]).toBe(`"'-2+3"`);
    expect(cells[1]![column('source')]).toBe(`"'-cmd"`);
    // "-1.5" is a number written as text: kept as it is, like the numeric columns.
    expect(cells[1]![column('assumed')]).toBe('-1.5');
    expect(cells[0]![column('massSlope')]).toBe('-0.31');
  });
});
