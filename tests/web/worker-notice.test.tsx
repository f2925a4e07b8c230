import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import type { AuditDetail } from '@/lib/schemas/audit';

// The screen reads its id from the route and never navigates while a run waits.
jest.mock('expo-router', () => ({
  useLocalSearchParams: () => ({ auditId: '12' }),
  useRouter: () => ({ setParams: jest.fn(), push: jest.fn(), replace: jest.fn(), back: jest.fn(), canGoBack: () => false }),
  Link: ({ children }: { children: React.ReactNode }) => children,
}));

import { AuditScreen } from '@/components/audits/audit-screen';

/** A run of the Gannet Sound relay network that no edge of has been swept yet. */
const waiting = (jobs: AuditDetail['jobs'], state: AuditDetail['state'] = 'sweeping'): AuditDetail => ({
  id: 12,
  networkId: 3,
  networkName: 'Gannet Sound harbour relay',
  version: 2,
  convention: 'in',
  state,
  settings: { ladder: { from: 2, to: 7, step: 0.5 }, signs: ['plus', 'minus'], tolerance: 0.01 },
  startedBy: { id: 2, name: 'Demo Analyst' },
  createdAt: '2026-03-02T08:00:00.000Z',
  finishedAt: null,
  progress: { done: 0, total: 40, etaSeconds: null },
  reason: null,
  lambda2: null,
  cluster: null,
  classCounts: {},
  flaggedCount: 0,
  undisposedCount: 0,
  rooted: null,
  cutOff: [],
  spectrum: [],
  lock: null,
  hashCheck: null,
  lastComment: null,
  allowed: ['cancel'],
  jobs,
});

/** The audit page over a stand-in API that knows this one audit and its (empty) trail. */
async function showAudit(detail: AuditDetail) {
  global.fetch = jest.fn(async (input: string) => {
    const path = String(input).replace('/api/v1', '').split('?')[0];
    const body = path === '/audits/12' ? detail : path === '/audits/12/trail' ? { entries: [], verified: true } : null;
    // jsdom has no Response; the client reads only ok, status and json().
    if (!body) return { ok: false, status: 404, json: async () => ({ error: { code: 'not-found', message: `no mock for ${path}` } }) };
    return { ok: true, status: 200, json: async () => body };
  }) as jest.Mock;
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <AuditScreen />
    </QueryClientProvider>,
  );
  // The bar is there once the detail has arrived, whatever the notice says.
  await screen.findByRole('progressbar', { name: '0 of 40 edges swept' });
}

describe('queue worker notice on a running audit', () => {
  test('with no queue worker connected, an alert says the run cannot move and names the command to start one', async () => {
    await showAudit(waiting({ mode: 'queue', workers: 0 }));
    const alert = screen.getByRole('alert', { name: 'No queue worker' });
    expect(alert.textContent).toMatch(/No queue worker is connected, so this run cannot move on\./);
    expect(alert.textContent).toMatch(/npm run worker/);
    // A glyph beside the words, so the meaning does not hang on the ochre frame.
    expect(alert.textContent!.trim().startsWith('!')).toBe(true);
  });

  test('a queued run (not yet sweeping) gets the same alert', async () => {
    await showAudit(waiting({ mode: 'queue', workers: 0 }, 'queued'));
    expect(screen.getByRole('alert', { name: 'No queue worker' })).toBeTruthy();
  });

  test('with a worker connected there is no notice', async () => {
    await showAudit(waiting({ mode: 'queue', workers: 1 }));
    expect(screen.queryByRole('alert')).toBeNull();
    expect(screen.queryByText(/queue worker/i)).toBeNull();
  });

  test('with several workers there is no notice either', async () => {
    await showAudit(waiting({ mode: 'queue', workers: 3 }));
    expect(screen.queryByText(/queue worker/i)).toBeNull();
  });

  test('when the server could not read the count, the page says so instead of guessing', async () => {
    await showAudit(waiting({ mode: 'queue', workers: null }));
    expect(screen.queryByRole('alert')).toBeNull();
    const note = screen.getByRole('note', { name: 'Queue workers unknown' });
    expect(note.textContent).toMatch(/number of connected queue workers could not be read/);
  });

  test('sweeps on the server’s own threads never show the notice', async () => {
    await showAudit(waiting({ mode: 'threads', workers: 1 }));
    expect(screen.queryByText(/queue worker/i)).toBeNull();
  });

  test('an older server that sends no count at all gets no notice', async () => {
    await showAudit(waiting(undefined));
    expect(screen.queryByText(/queue worker/i)).toBeNull();
  });
});
