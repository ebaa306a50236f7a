import { acceptedSnapshot, refusal, snapshotState } from './pushAnswers';
import type { HttpAnswer } from './pushHttp';

const SERVER = 'https://seamline.example.com';
const answer = (status: number, body: unknown, extra: Partial<HttpAnswer> = {}): HttpAnswer => ({
  status,
  statusText: '',
  contentType: 'application/json',
  body: typeof body === 'string' ? body : JSON.stringify(body),
  ...extra,
});

describe('refusal', () => {
  it("should show the server's message with the status", () => {
    expect(refusal(answer(401, { error: { code: 'unauthorized', message: 'The API token is not valid.' } }), SERVER).reason).toBe(
      'The API token is not valid. (HTTP 401)',
    );
  });

  it('should say that an answer without a Seamline error probably comes from somewhere else', () => {
    expect(refusal(answer(502, '<html>Bad gateway</html>', { statusText: 'Bad Gateway' }), SERVER).reason).toBe(
      `the server at ${SERVER} answered HTTP 502 Bad Gateway without a Seamline error message; is --server the address of a Seamline server?`,
    );
    expect(refusal(answer(400, { error: { code: 'x', message: ' ' } }), SERVER).reason).toMatch(/without a Seamline error message/);
    expect(refusal(answer(400, { error: 'nope' }), SERVER).reason).toMatch(/without a Seamline error message/);
  });

  it('should name where a redirect points, since redirects are not followed', () => {
    expect(refusal(answer(301, '', { statusText: 'Moved Permanently', location: 'https://other.example.com/api/push' }), 'http://seamline.example.com').reason).toBe(
      'the server at http://seamline.example.com answered HTTP 301 Moved Permanently, a redirect to https://other.example.com/api/push; give the address it redirects to as --server (redirects are not followed, so the token stays where you sent it)',
    );
  });
});

describe('acceptedSnapshot', () => {
  it('should take the id and status of the accepted snapshot', () => {
    const body = { snapshot: { id: 'id-1', status: 'queued', codebaseId: 'cb-1' }, links: { status: '/api/snapshots/id-1' } };
    expect(acceptedSnapshot(answer(202, body), SERVER)).toEqual({ id: 'id-1', status: 'queued' });
  });

  it.each<[string, string]>([
    ['not JSON', '{"snapshot": '],
    ['no snapshot', '{"ok": true}'],
    ['an empty id', '{"snapshot": {"id": "", "status": "queued"}}'],
    ['no status', '{"snapshot": {"id": "x"}}'],
  ])('should refuse a 2xx answer with %s', (_what, body) => {
    expect(() => acceptedSnapshot(answer(202, body), SERVER)).toThrow(
      `the server at ${SERVER} answered HTTP 202 but not with the accepted snapshot (the upload may have been stored); is --server the address of a Seamline server?`,
    );
  });

  it('should turn a non-2xx answer into the refusal', () => {
    expect(() => acceptedSnapshot(answer(413, { error: { code: 'too_large', message: 'The snapshot is over 100 MB.' } }), SERVER)).toThrow(
      'The snapshot is over 100 MB. (HTTP 413)',
    );
  });
});

describe('snapshotState', () => {
  it('should read status, progress, phase and error, dropping empty ones', () => {
    expect(snapshotState(answer(200, { snapshot: { id: 'a', status: 'running', progress: 40, phase: 'modules', error: null } }), SERVER)).toEqual({
      id: 'a',
      status: 'running',
      progress: 40,
      phase: 'modules',
      error: undefined,
    });
    expect(snapshotState(answer(200, { snapshot: { id: 'a', status: 'failed', progress: null, phase: '', error: ' out of memory ' } }), SERVER)).toEqual({
      id: 'a',
      status: 'failed',
      progress: undefined,
      phase: undefined,
      error: 'out of memory',
    });
  });

  it('should refuse a status answer of another shape', () => {
    expect(() => snapshotState(answer(200, '[]'), SERVER)).toThrow(`the server at ${SERVER} answered HTTP 200 but not with the snapshot's status`);
  });
});
