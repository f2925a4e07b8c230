import request from 'supertest';
import { listRoutes } from '../../server/http/route-list';
import { accountsWorld, browser, signedIn, type AccountsWorld } from './support/accounts';

const callers = ['anonymous', 'admin', 'analyst', 'auditor', 'approver'] as const;
type Caller = (typeof callers)[number];

interface Row {
  /** The concrete request: path parameters filled in, a body where one is sent. */
  path?: string;
  body?: object;
  /** Expected status for anonymous, admin, analyst, auditor, approver. */
  expect: [number, number, number, number, number];
}

/**
 * Every API route × every kind of caller. An empty or minimal request is
 * enough: a caller that may not use the route gets 401/403 before any
 * validation, and one that may gets past it (200, 201, 204, or a 400/404
 * from validation). Add a row when you add a route: the first test fails
 * until you do.
 */
const matrix: Record<string, Row> = {
  'GET /api/v1/health': { expect: [200, 200, 200, 200, 200] },
  'POST /api/v1/auth/sign-in': { body: {}, expect: [400, 400, 400, 400, 400] },
  'GET /api/v1/auth/me': { expect: [401, 200, 200, 200, 200] },
  'PUT /api/v1/auth/password': { body: {}, expect: [401, 400, 400, 400, 400] },
  'POST /api/v1/auth/invitation/accept': { body: {}, expect: [400, 400, 400, 400, 400] },
  'POST /api/v1/auth/password-reset/request': { body: { email: 'nobody@gannet-sound.test' }, expect: [202, 202, 202, 202, 202] },
  'POST /api/v1/auth/password-reset/complete': { body: {}, expect: [400, 400, 400, 400, 400] },
  'GET /api/v1/users': { expect: [401, 200, 403, 403, 403] },
  'POST /api/v1/users': { body: {}, expect: [401, 400, 403, 403, 403] },
  'PUT /api/v1/users/:userId/roles': { path: '/api/v1/users/99999/roles', body: { roles: ['auditor'] }, expect: [401, 404, 403, 403, 403] },
  'POST /api/v1/users/:userId/deactivate': { path: '/api/v1/users/99999/deactivate', body: { reason: 'matrix' }, expect: [401, 404, 403, 403, 403] },
  'GET /api/v1/tokens': { expect: [401, 403, 200, 403, 403] },
  'POST /api/v1/tokens': { body: {}, expect: [401, 403, 400, 403, 403] },
  'DELETE /api/v1/tokens/:tokenId': { path: '/api/v1/tokens/99999', expect: [401, 403, 404, 403, 403] },
  'GET /api/v1/outbox': { expect: [401, 200, 403, 403, 403] },
  'GET /api/v1/networks': { expect: [401, 200, 200, 200, 200] },
  'POST /api/v1/networks/import': { body: {}, expect: [401, 403, 400, 403, 403] },
  'GET /api/v1/networks/:networkId': { path: '/api/v1/networks/99999', expect: [401, 404, 404, 404, 404] },
  'GET /api/v1/networks/:networkId/versions/:version': { path: '/api/v1/networks/99999/versions/1', expect: [401, 404, 404, 404, 404] },
  'GET /api/v1/networks/:networkId/diff': { path: '/api/v1/networks/99999/diff', expect: [401, 400, 400, 400, 400] },
  'POST /api/v1/audits': { body: {}, expect: [401, 403, 400, 403, 403] },
  'GET /api/v1/audits': { expect: [401, 200, 200, 200, 200] },
  'GET /api/v1/audits/:auditId': { path: '/api/v1/audits/99999', expect: [401, 404, 404, 404, 404] },
  'POST /api/v1/audits/:auditId/cancel': { path: '/api/v1/audits/99999/cancel', expect: [401, 403, 404, 403, 403] },
  'GET /api/v1/audits/:auditId/edges': { path: '/api/v1/audits/99999/edges', expect: [401, 404, 404, 404, 404] },
  'GET /api/v1/audits/:auditId/edges.csv': { path: '/api/v1/audits/99999/edges.csv', expect: [401, 404, 404, 404, 404] },
  'GET /api/v1/audits/:auditId/edges/:edgeIndex': { path: '/api/v1/audits/99999/edges/0', expect: [401, 404, 404, 404, 404] },
  'PUT /api/v1/audits/:auditId/edges/:edgeIndex/disposition': { path: '/api/v1/audits/99999/edges/0/disposition', body: {}, expect: [401, 403, 403, 400, 403] },
  'POST /api/v1/audits/:auditId/submit': { path: '/api/v1/audits/99999/submit', body: {}, expect: [401, 403, 403, 404, 403] },
  'POST /api/v1/audits/:auditId/return': { path: '/api/v1/audits/99999/return', body: {}, expect: [401, 403, 403, 400, 400] },
  'POST /api/v1/audits/:auditId/reopen': { path: '/api/v1/audits/99999/reopen', body: {}, expect: [401, 403, 404, 403, 403] },
  'POST /api/v1/audits/:auditId/lock': { path: '/api/v1/audits/99999/lock', body: {}, expect: [401, 403, 403, 403, 400] },
  'GET /api/v1/audits/:auditId/trail': { path: '/api/v1/audits/99999/trail', expect: [401, 404, 404, 404, 404] },
  'GET /api/v1/audits/:auditId/report.pdf': { path: '/api/v1/audits/99999/report.pdf', expect: [401, 404, 404, 404, 404] },
  // Last: it ends the caller's session.
  'POST /api/v1/auth/sign-out': { expect: [204, 204, 204, 204, 204] },
};

describe('route × role matrix', () => {
  let w: AccountsWorld;
  const agents = {} as Record<Caller, ReturnType<typeof browser>>;
  beforeAll(async () => {
    w = await accountsWorld({ HAIRLINE_SIGN_IN_LIMIT: '1000' });
    agents.anonymous = browser(w.app);
    for (const role of callers.slice(1) as Exclude<Caller, 'anonymous'>[]) agents[role] = await signedIn(w, role);
  });
  afterAll(() => w.close());

  test('the matrix lists exactly the routes the server answers', () => {
    const live = listRoutes((w.app as unknown as { router: Parameters<typeof listRoutes>[0] }).router)
      .filter((r) => r.path.startsWith('/api/'))
      .map((r) => `${r.method} ${r.path}`);
    expect(live.filter((r) => !(r in matrix))).toEqual([]); // a route nobody decided the roles for
    expect(Object.keys(matrix).filter((r) => !live.includes(r))).toEqual([]); // a row for a route that is gone
  });

  test.each(Object.entries(matrix))('%s', async (route, row) => {
    const [method, pattern] = route.split(' ');
    const got: Record<string, number> = {};
    const want: Record<string, number> = {};
    for (const [i, caller] of callers.entries()) {
      const agent = agents[caller];
      const path = row.path ?? pattern;
      const m = method.toLowerCase() as 'get' | 'post' | 'put' | 'delete';
      const res = await (row.body ? agent[m](path).send(row.body) : agent[m](path));
      got[caller] = res.status;
      want[caller] = row.expect[i];
      if (res.status >= 400) expect(res.body.error).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
    }
    expect(got).toEqual(want);
  });

  test('a signed-in caller of every role still needs the Origin check for writes', async () => {
    const res = await request(w.app).post('/api/v1/auth/sign-out').set('Host', 'hairline.test');
    expect(res.status).toBe(403);
  });
});
