import request from 'supertest';
import { openTestApp, type TestApp } from '../../testing/test-app';

describe('the HTTP basics', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await openTestApp({ SEAMLINE_WEB_DIST: '/nonexistent/web' });
  });
  afterAll(() => t.close());

  it('should answer GET /api/health without a session when the database answers', async () => {
    const res = await request(t.app).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', database: 'ok' });
  });

  it('should send security headers', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('should answer unknown API paths with the JSON error shape, not the web app', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('should refuse a malformed JSON body with a 400 in the shared shape', async () => {
    const res = await request(t.app).post('/api/auth/logout').set('Content-Type', 'application/json').send('{"broken":');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBeTruthy();
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/);
  });

  it('should say clearly when the web app has not been built', async () => {
    const res = await request(t.app).get('/overview').expect(503);
    expect(res.text).toMatch(/npm run build/);
  });
});
