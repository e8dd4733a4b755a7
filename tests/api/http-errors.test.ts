import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, uniqueEmail, GOOD_PASSWORD, type TestContext } from '../support/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestApp({ JSON_BODY_LIMIT: '2kb' });
});
afterAll(() => ctx.close());

describe('error bodies', () => {
  it('answers malformed JSON with a 400 JSON error', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email": ').expect(400);
    expect(res.body).toEqual({ error: { code: 'malformed_json', message: expect.any(String) } });
  });

  it('answers an oversized body with 413', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), password: GOOD_PASSWORD, name: 'x'.repeat(5000), department: 'D' })
      .expect(413);
    expect(res.body.error.code).toBe('body_too_large');
  });

  it('names a missing field', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-up').send({ email: uniqueEmail(), password: GOOD_PASSWORD, name: 'A' }).expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_input', field: 'department' });
    expect(res.body.error.message).toMatch(/department is required/);
  });

  it('names an extra field', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/sign-in')
      .send({ email: uniqueEmail(), password: GOOD_PASSWORD, remember: true })
      .expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_input', field: 'remember' });
    expect(res.body.error.message).toMatch(/remember is not a field/);
  });

  it('names a field of the wrong type', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-in').send({ email: 42, password: GOOD_PASSWORD }).expect(400);
    expect(res.body.error.field).toBe('email');
  });

  it('answers a body that is not an object', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('[1,2]').expect(400);
    expect(res.body.error.code).toBe('invalid_input');
  });

  it('answers an unknown API path with a JSON 404', async () => {
    const res = await request(ctx.app).get('/api/no-such-thing').expect(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('sends security headers', async () => {
    const res = await request(ctx.app).get('/api/health').expect(200);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.body).toMatchObject({ status: 'ok', database: { reachable: true } });
  });
});

describe('Host check (issue 9, DNS rebinding)', () => {
  it('refuses a request whose Host is not an allowed host, and serves 127.0.0.1 and localhost', async () => {
    const rebound = await request(ctx.app).get('/api/health').set('Host', 'attacker.example:3000').expect(421);
    expect(rebound.body.error.code).toBe('host_not_allowed');
    expect(rebound.body.error.message).toMatch(/ALLOWED_HOSTS/);
    await request(ctx.app).get('/api/health').set('Host', 'localhost:3000').expect(200);
    await request(ctx.app).get('/api/health').expect(200);
  });

  it('answers only the configured ALLOWED_HOSTS when set', async () => {
    const own = await createTestApp({ ALLOWED_HOSTS: 'tidefield.example, 127.0.0.1' });
    try {
      await request(own.app).get('/api/health').set('Host', 'tidefield.example').expect(200);
      await request(own.app).get('/api/health').set('Host', 'localhost').expect(421);
      await request(own.app).get('/api/health').expect(200);
    } finally {
      await own.close();
    }
  });
});

describe('malformed requests answer 4xx with the JSON error shape (issue 9, item 8)', () => {
  const CSV = 'class,massUnit,massMin,massMax,periodMinDays,periodMaxDays,occurrence\nplanet,MJup,1,2,10,100,0.1\n';
  let modeller: request.Agent;
  beforeAll(async () => {
    const { signUp } = await import('../support/test-app.ts');
    modeller = (await signUp(ctx.app)).agent;
  });

  const expectJsonError = (res: request.Response, statuses: number[]) => {
    expect(statuses).toContain(res.status);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.body.error).toMatchObject({ code: expect.any(String), message: expect.any(String) });
  };

  it('CSV upload with the file in the wrong field names the field', async () => {
    const res = await modeller.post('/api/occurrence-tables/preview').attach('data', Buffer.from(CSV), 'x.csv');
    expectJsonError(res, [400]);
    expect(res.body.error.field).toBe('data');
    expect(res.body.error.message).toMatch(/"file"/);
  });

  it('CSV upload with two files', async () => {
    const res = await modeller.post('/api/occurrence-tables/preview').attach('file', Buffer.from(CSV), 'a.csv').attach('file', Buffer.from(CSV), 'b.csv');
    expectJsonError(res, [400, 413]);
    expect(res.body.error.field).toBe('file');
  });

  it('CSV upload with too many fields', async () => {
    let req = modeller.post('/api/occurrence-tables/upload');
    for (let i = 0; i < 12; i += 1) req = req.field(`f${i}`, 'x');
    const res = await req.attach('file', Buffer.from(CSV), 'a.csv');
    expectJsonError(res, [400, 413]);
  });

  it('truncated multipart body', async () => {
    const body = `--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\n${CSV}`;
    const res = await modeller.post('/api/occurrence-tables/preview').set('Content-Type', 'multipart/form-data; boundary=XYZ').send(body);
    expectJsonError(res, [400]);
  });

  it('multipart without a boundary', async () => {
    const res = await modeller.post('/api/occurrence-tables/preview').set('Content-Type', 'multipart/form-data').send('garbage');
    expectJsonError(res, [400, 415]);
  });

  for (const encoding of ['gzip', 'deflate', 'br']) {
    it(`${encoding} body holding garbage`, async () => {
      const res = await request(ctx.app)
        .post('/api/auth/sign-in')
        .set('Content-Type', 'application/json')
        .set('Content-Encoding', encoding)
        .send(Buffer.from('this is not compressed at all, just bytes'));
      expectJsonError(res, [400, 415]);
    });
  }

  it('header-only CSV: "no rows"', async () => {
    const res = await modeller.post('/api/occurrence-tables/upload').field('name', 'Empty').attach('file', Buffer.from(CSV.split('\n')[0] + '\n'), 'a.csv');
    expectJsonError(res, [400]);
    expect(res.body.error).toMatchObject({ code: 'csv_invalid', field: 'file' });
    expect(res.body.error.message).toMatch(/no rows/);
    expect((await modeller.get('/api/occurrence-tables').expect(200)).body.tables.some((t: { name: string }) => t.name === 'Empty')).toBe(false);
  });

  it('a NUL in a name is refused naming the field', async () => {
    const res = await modeller.post('/api/samples').send({ name: 'bad\u0000name', magnetic: 1, total: 2 });
    expectJsonError(res, [400]);
    expect(res.body.error.field).toBe('name');
    expect(res.body.error.message).toMatch(/NUL/);
  });

  it('a __proto__ key is refused naming it', async () => {
    const res = await modeller.post('/api/samples').set('Content-Type', 'application/json').send('{"name":"x","magnetic":1,"total":2,"__proto__":{"admin":true}}');
    expectJsonError(res, [400]);
    expect(res.body.error.field).toBe('__proto__');
  });
});
