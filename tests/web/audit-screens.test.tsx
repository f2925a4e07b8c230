import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import type { AuditDetail, EdgeDetail, EdgeRow } from '@/lib/schemas/audit';

// expo-router's own test renderer needs @testing-library/react-native; the screens
// only read params and call the router, so those two are stood in for here.
let mockParams: Record<string, string> = {};
const mockRouter = { setParams: jest.fn(), push: jest.fn(), replace: jest.fn(), back: jest.fn(), canGoBack: () => false };
jest.mock('expo-router', () => ({
  useLocalSearchParams: () => mockParams,
  useRouter: () => mockRouter,
  Link: ({ children }: { children: React.ReactNode }) => children,
}));

// The table is built on wide windows and the cards on narrow ones; jsdom has no layout, so the test picks.
let mockWide = true;
jest.mock('@/components/audits/use-wide', () => ({ useWide: () => mockWide }));

import { AuditScreen } from '@/components/audits/audit-screen';
import { EdgeDetailView } from '@/components/audits/edge-detail-view';

type Call = { url: string; method: string; body: unknown };
let calls: Call[] = [];
type Reply = { status?: number; body: unknown };

/** Answers by method and path; jsdom has no Response, and the client reads only ok, status and json(). */
function mockApi(routes: Record<string, Reply | ((c: Call) => Reply)>) {
  calls = [];
  global.fetch = jest.fn(async (input: string, init: RequestInit = {}) => {
    const method = init.method ?? 'GET';
    const url = String(input);
    const call = { url, method, body: init.body ? JSON.parse(String(init.body)) : undefined };
    calls.push(call);
    const path = url.replace('/api/v1', '').split('?')[0];
    const hit = routes[`${method} ${path}`];
    if (!hit) return { ok: false, status: 404, json: async () => ({ error: { code: 'not-found', message: `no mock for ${method} ${path}` } }) };
    const r = typeof hit === 'function' ? hit(call) : hit;
    const status = r.status ?? 200;
    return { ok: status < 400, status, json: async () => r.body };
  }) as jest.Mock;
}

function renderWithQuery(ui: React.ReactElement) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(<QueryClientProvider client={client}>{ui}</QueryClientProvider>);
}

const audit = (over: Partial<AuditDetail> = {}): AuditDetail => ({
  id: 7,
  networkId: 1,
  networkName: 'Gannet Sound buoy relay',
  version: 1,
  convention: 'in',
  state: 'in-review',
  settings: { ladder: { from: 2, to: 7, step: 0.5 }, signs: ['plus', 'minus'], tolerance: 0.01 },
  startedBy: { id: 2, name: 'Demo Analyst' },
  createdAt: '2026-03-01T10:00:00.000Z',
  finishedAt: '2026-03-01T10:01:00.000Z',
  progress: { done: 10, total: 10, etaSeconds: null },
  reason: null,
  lambda2: { re: 0.42, im: 0 },
  cluster: { size: 2, spread: 1e-8 },
  classCounts: { linear: 7, 'square-root': 2, 'cube-root': 1 },
  flaggedCount: 3,
  undisposedCount: 3,
  rooted: true,
  cutOff: [],
  spectrum: [],
  lock: null,
  hashCheck: null,
  lastComment: null,
  allowed: ['dispose', 'submit', 'return'],
  ...over,
});

const row = (i: number, over: Partial<EdgeRow> = {}): EdgeRow => ({
  edgeIndex: i,
  source: `mast-${i}`,
  target: `buoy-${i}`,
  weight: 1.5,
  class: 'square-root',
  plusClass: 'square-root',
  plusExponent: 0.5,
  minusClass: 'linear',
  minusExponent: 1,
  flags: [],
  tolerance: 2e-5,
  toleranceRel: 1.3e-5,
  sensitivity: null,
  flagged: true,
  disposition: null,
  ...over,
});

const trail = { entries: [{ id: 1, at: '2026-03-01T10:00:00.000Z', actor: 'Demo Analyst', action: 'audit.started', oldValue: null, newValue: '{"tolerance":0.01}', reason: null, hash: 'ab' }], verified: true };

beforeEach(() => {
  mockParams = { auditId: '7' };
  mockWide = true;
  jest.clearAllMocks();
});

describe('audit page', () => {
  test('in review: header, caution, class counts, the edges from the server, and a shareable filter', async () => {
    mockApi({
      'GET /audits/7': { body: audit() },
      'GET /audits/7/edges': { body: { rows: [row(3), row(5, { class: 'cube-root', plusExponent: 0.33 })], total: 2, page: 1, pageSize: 50 } },
      'GET /audits/7/trail': { body: trail },
    });
    mockParams = { auditId: '7', class: 'square-root', sort: 'tolerance', dir: 'desc' };
    renderWithQuery(<AuditScreen />);
    expect(await screen.findByRole('heading', { name: 'Gannet Sound buoy relay' })).toBeTruthy();
    expect(screen.getByText(/do not replace it, nor the codes and standards/)).toBeTruthy();
    expect(screen.getByText('in review')).toBeTruthy();
    // The table asked the server for exactly the URL's filter and sort.
    await screen.findByRole('table', { name: 'Edges' });
    const edgesCall = calls.find((c) => c.url.includes('/edges?'))!;
    expect(edgesCall.url).toContain('class=square-root');
    expect(edgesCall.url).toContain('sort=tolerance&dir=desc');
    expect(screen.getByRole('row', { name: 'Edge 3: mast-3 → buoy-3, square-root' })).toBeTruthy();
    expect(screen.queryByRole('list', { name: 'Edges' })).toBeNull();
    expect(screen.getByRole('columnheader', { name: 'Sort by tolerance |ε|' }).getAttribute('aria-sort')).toBe('descending');
    // The CSV link carries the filters but not the page.
    const csv = screen.getByText(/CSV of this table/).closest('a')!;
    expect(csv.getAttribute('href')).toBe('/api/v1/audits/7/edges.csv?class=square-root&sort=tolerance&dir=desc');
    expect(screen.getByText(/The hash chain verifies/)).toBeTruthy();

    // Adding a class filter writes it to the URL and returns to page 1.
    fireEvent.click(screen.getByRole('checkbox', { name: 'cube-root' }));
    expect(mockRouter.setParams).toHaveBeenLastCalledWith(expect.objectContaining({ class: 'square-root,cube-root', page: undefined, sort: 'tolerance', dir: 'desc' }));
    // Sorting by a column header goes through TanStack Table to the URL.
    fireEvent.click(screen.getByRole('columnheader', { name: 'Sort by weight' }));
    expect(mockRouter.setParams).toHaveBeenLastCalledWith(expect.objectContaining({ sort: 'weight', dir: undefined }));
  });

  test('on a phone the same rows are cards that link to the edge page, with the sort among the filters', async () => {
    mockWide = false;
    mockApi({
      'GET /audits/7': { body: audit() },
      'GET /audits/7/edges': { body: { rows: [row(3), row(5, { disposition: { kind: 'monitor', note: 'watch it', by: 'Demo Auditor', at: '2026-03-01T11:00:00.000Z' } })], total: 2, page: 1, pageSize: 50 } },
      'GET /audits/7/trail': { body: trail },
    });
    renderWithQuery(<AuditScreen />);
    const list = await screen.findByRole('list', { name: 'Edges' });
    expect(screen.queryByRole('table')).toBeNull();
    expect(within(list).getByRole('link', { name: 'Edge 5: mast-5 → buoy-5, square-root' })).toBeTruthy();
    expect(within(list).getByText('needs one', { exact: false })).toBeTruthy();
    expect(within(list).getByText('monitor', { exact: false })).toBeTruthy();
    fireEvent.click(screen.getByRole('radio', { name: 'tolerance %' }));
    expect(mockRouter.setParams).toHaveBeenLastCalledWith(expect.objectContaining({ sort: 'toleranceRel', page: undefined }));
    fireEvent.click(screen.getByRole('button', { name: '▲ Ascending' }));
    expect(mockRouter.setParams).toHaveBeenLastCalledWith(expect.objectContaining({ dir: 'desc' }));
  });

  test('while sweeping: a progress bar with time left, a cancel step, and no table', async () => {
    let current = audit({ state: 'sweeping', progress: { done: 4, total: 11, etaSeconds: 95 }, allowed: ['cancel'], lambda2: null });
    mockApi({
      'GET /audits/7': () => ({ body: current }),
      'GET /audits/7/trail': { body: trail },
      'POST /audits/7/cancel': () => ({ body: (current = audit({ state: 'cancelled', reason: 'cancelled by Demo Analyst', allowed: [] })) }),
    });
    renderWithQuery(<AuditScreen />);
    expect(await screen.findByText('4 of 11 edges · about 1 min 35 s left')).toBeTruthy();
    expect(screen.getByRole('progressbar', { name: '4 of 11 edges swept' })).toBeTruthy();
    expect(screen.queryByRole('table')).toBeNull();
    expect(calls.some((c) => c.url.includes('/edges'))).toBe(false);
    fireEvent.click(screen.getByRole('button', { name: 'Cancel the run' }));
    fireEvent.click(screen.getByRole('button', { name: 'Stop the sweep' }));
    expect(await screen.findByText(/cancelled by Demo Analyst/)).toBeTruthy();
    expect(calls.find((c) => c.method === 'POST')!.url).toBe('/api/v1/audits/7/cancel');
  });

  test('submitting with undisposed flagged edges shows each one and offers to filter to them', async () => {
    mockApi({
      'GET /audits/7': { body: audit() },
      'GET /audits/7/edges': { body: { rows: [row(3)], total: 1, page: 1, pageSize: 50 } },
      'GET /audits/7/trail': { body: trail },
      'POST /audits/7/submit': {
        status: 409,
        body: { error: { code: 'undisposed', message: '1 flagged edge has no disposition yet; record one for each before submitting.', problems: [{ code: 'undisposed', message: 'edge 3 (mast-3 → buoy-3, square-root) has no disposition', element: 'edge 3' }] } },
      },
    });
    renderWithQuery(<AuditScreen />);
    fireEvent.click(await screen.findByRole('button', { name: 'Submit for sign-off' }));
    fireEvent.click(screen.getAllByRole('button', { name: 'Submit for sign-off' }).at(-1)!);
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText(/edge 3 \(mast-3 → buoy-3, square-root\) has no disposition/)).toBeTruthy();
    fireEvent.click(within(alert).getByRole('button', { name: 'Show them in the table' }));
    expect(mockRouter.setParams).toHaveBeenLastCalledWith(expect.objectContaining({ flagged: 'yes', disposition: 'none', class: undefined }));
  });

  test('sealing needs a comment, then an explicit confirmation, and sends the comment', async () => {
    const sealed = audit({
      state: 'sealed',
      allowed: [],
      undisposedCount: 0,
      lock: { by: { id: 4, name: 'Demo Approver' }, at: '2026-03-02T09:00:00.000Z', meaning: 'approved', comment: 'Checked against the site survey.', hash: 'a'.repeat(64) },
      hashCheck: { recomputed: 'a'.repeat(64), matches: true },
    });
    let current = audit({ state: 'awaiting-sign-off', allowed: ['return', 'lock'], undisposedCount: 0 });
    mockApi({
      'GET /audits/7': () => ({ body: current }),
      'GET /audits/7/edges': { body: { rows: [row(3)], total: 1, page: 1, pageSize: 50 } },
      'GET /audits/7/trail': { body: trail },
      'POST /audits/7/lock': () => ({ body: (current = sealed) }),
    });
    renderWithQuery(<AuditScreen />);
    fireEvent.click(await screen.findByRole('button', { name: 'Seal the audit…' }));
    expect(screen.getByText(/It is irreversible/)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Continue to confirmation' }));
    expect(screen.getByText('× a comment is required')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Comment (required)'), { target: { value: 'Checked against the site survey.' } });
    fireEvent.click(screen.getByRole('button', { name: 'Continue to confirmation' }));
    expect(screen.getByText('Seal audit #7 for good?')).toBeTruthy();
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
    fireEvent.click(screen.getByRole('button', { name: 'Seal it — this cannot be undone' }));
    expect(await screen.findByText(/it matches\. Nothing has changed since sealing/)).toBeTruthy();
    expect(calls.find((c) => c.method === 'POST')).toMatchObject({ url: '/api/v1/audits/7/lock', body: { comment: 'Checked against the site survey.' } });
    expect(screen.getByText(`${'aaaaaaaa '.repeat(8).trim()}`)).toBeTruthy();
  });

  test('a sealed audit whose records changed says so, with the recomputed hash', async () => {
    mockApi({
      'GET /audits/7': {
        body: audit({
          state: 'sealed',
          allowed: [],
          lock: { by: { id: 4, name: 'Demo Approver' }, at: '2026-03-02T09:00:00.000Z', meaning: 'approved', comment: 'ok then', hash: 'a'.repeat(64) },
          hashCheck: { recomputed: 'b'.repeat(64), matches: false },
        }),
      },
      'GET /audits/7/edges': { body: { rows: [], total: 0, page: 1, pageSize: 50 } },
      'GET /audits/7/trail': { body: { ...trail, verified: false } },
    });
    renderWithQuery(<AuditScreen />);
    expect(await screen.findByText(/does NOT match/)).toBeTruthy();
    expect(screen.getByText('bbbbbbbb '.repeat(8).trim())).toBeTruthy();
    expect(await screen.findByText(/hash chain is broken/)).toBeTruthy();
  });

  test('four-eyes refusal is explained', async () => {
    mockApi({
      'GET /audits/7': { body: audit({ state: 'awaiting-sign-off', allowed: ['return', 'lock'] }) },
      'GET /audits/7/edges': { body: { rows: [], total: 0, page: 1, pageSize: 50 } },
      'GET /audits/7/trail': { body: trail },
      'POST /audits/7/lock': { status: 403, body: { error: { code: 'four-eyes', message: 'You started this audit, so another approver must seal it.' } } },
    });
    renderWithQuery(<AuditScreen />);
    fireEvent.click(await screen.findByRole('button', { name: 'Seal the audit…' }));
    fireEvent.change(screen.getByLabelText('Comment (required)'), { target: { value: 'fine by me' } });
    fireEvent.click(screen.getByRole('button', { name: 'Continue to confirmation' }));
    fireEvent.click(screen.getByRole('button', { name: 'Seal it — this cannot be undone' }));
    expect(await screen.findByText(/another approver must seal it/)).toBeTruthy();
    expect(screen.getByText(/who did not start this run, has to seal it/)).toBeTruthy();
  });
});

describe('edge detail', () => {
  const detail = (over: Partial<EdgeDetail> = {}): EdgeDetail => ({
    ...row(3),
    plus: {
      class: 'square-root', exponent: 0.5, prefactor: -0.8, flags: ['crossover'], slopeSmall: 1, slopeLarge: 0.5, crossoverEps: 1e-4, noiseFloor: 1e-10,
      points: [1e-2, 1e-3, 1e-4, 1e-5].map((e, i) => ({ eps: e, delta: -0.8 * Math.sqrt(e), floor: 1e-10, used: i < 3 ? 1 : 0, tracked: 1 })),
    },
    minus: null,
    budget: { eps: 2e-5, relative: 1.3e-5, limitedBy: 'plus', allowedDelta: 0.0042, confirmed: true },
    sensitivityDetail: null,
    ...over,
  });

  test('the plot, the figures, and an auditor’s disposition sent to the server', async () => {
    mockApi({
      'GET /audits/7/edges/3': { body: detail() },
      'PUT /audits/7/edges/3/disposition': (c) => ({ body: row(3, { disposition: { kind: 'mitigate', note: (c.body as { note: string }).note, by: 'Demo Auditor', at: '2026-03-01T11:00:00.000Z' } }) }),
    });
    renderWithQuery(<EdgeDetailView audit={audit()} edgeIndex={3} />);
    expect(await screen.findByRole('heading', { name: 'mast-3 → buoy-3' })).toBeTruthy();
    expect(screen.getByLabelText(/Response plot: 4 points, 3 used in the fit, 1 fitted line/)).toBeTruthy();
    expect(screen.getByText(/crossover: the local exponent drifts/)).toBeTruthy();
    expect(screen.getByText('the +ε side')).toBeTruthy();
    expect(screen.getByText(/no derivative exists/)).toBeTruthy();

    fireEvent.click(screen.getByRole('radio', { name: '△ mitigate' }));
    fireEvent.click(screen.getByRole('button', { name: 'Record disposition' }));
    expect(screen.getByText('× say why in a few words')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Note'), { target: { value: 'Recalibrate the mast-3 link gain.' } });
    await act(async () => {
      fireEvent.click(screen.getByRole('button', { name: 'Record disposition' }));
    });
    await waitFor(() => expect(screen.getByText('● Saved')).toBeTruthy());
    expect(calls.find((c) => c.method === 'PUT')).toMatchObject({ url: '/api/v1/audits/7/edges/3/disposition', body: { kind: 'mitigate', note: 'Recalibrate the mast-3 link gain.' } });
  });

  test('without the dispose right there is no form, only the record', async () => {
    mockApi({ 'GET /audits/7/edges/3': { body: detail({ disposition: { kind: 'accept', note: 'Within the margin.', by: 'Demo Auditor', at: '2026-03-01T11:00:00.000Z' } }) } });
    renderWithQuery(<EdgeDetailView audit={audit({ state: 'sealed', allowed: [] })} edgeIndex={3} />);
    expect(await screen.findByText('Within the margin.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /disposition/ })).toBeNull();
  });
});
