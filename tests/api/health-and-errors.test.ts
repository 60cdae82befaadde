import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { buildApiHarness } from '../setup/api-app';
import { closeTestDb, testDb } from '../setup/database';

const harness = await buildApiHarness(testDb());
afterAll(async () => {
  await harness.close();
  await closeTestDb();
});

describe('GET /api/health', () => {
  it('answers 200 with the database status, without a session', async () => {
    const response = await request(harness.app).get('/api/health');
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ status: 'ok', database: { status: 'up' } });
    expect(response.headers['set-cookie']).toBeUndefined();
    expect(response.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });
});

describe('problem+json', () => {
  it('answers an unknown API route with a 404 problem', async () => {
    const response = await request(harness.app).get('/api/no-such-thing');
    expect(response.status).toBe(404);
    expect(response.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(response.body).toMatchObject({
      type: '/problems/not-found',
      status: 404,
      instance: '/api/no-such-thing',
    });
    expect(response.body.requestId).toBe(response.headers['x-request-id']);
  });

  it('refuses the API to someone not signed in with 401', async () => {
    const response = await request(harness.app).get('/api/me');
    expect(response.status).toBe(401);
    expect(response.body).toMatchObject({
      type: '/problems/not-signed-in',
      title: 'Not signed in',
    });
  });

  it('turns a forged session cookie into "not signed in", never a crash', async () => {
    const response = await request(harness.app)
      .get('/api/me')
      .set('Cookie', 'wardbook.sid=s%3Aforged-session-id.bm90LWEtcmVhbC1zaWduYXR1cmU');
    expect(response.status).toBe(401);
    expect(response.body.type).toBe('/problems/not-signed-in');
  });

  it('refuses a state-changing request without the CSRF token', async () => {
    const response = await request(harness.app).post('/auth/logout');
    expect(response.status).toBe(403);
    expect(response.body).toMatchObject({ type: '/problems/csrf', title: 'Security check failed' });
  });

  it('reports a malformed JSON body as a 400 problem, with no stack trace', async () => {
    const response = await request(harness.app)
      .post('/api/anything')
      .set('content-type', 'application/json')
      .send('{"not json');
    expect(response.status).toBe(400);
    expect(response.body.type).toBe('/problems/malformed-body');
    expect(JSON.stringify(response.body)).not.toMatch(/at .*\.ts:\d+/);
  });

  it('sends a strict Content-Security-Policy', async () => {
    const response = await request(harness.app).get('/api/health');
    const csp = response.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toContain('unsafe-inline');
  });
});
