import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import { ServerStatus } from '@/components/overview/server-status';
import { isCurrent } from '@/components/shell/nav-items';

function renderWithQuery(ui: React.ReactElement) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(<QueryClientProvider client={client}>{ui}</QueryClientProvider>);
}

function mockFetch(status: number, body: unknown) {
  // jsdom has no Response class; the client only reads ok, status and json().
  global.fetch = jest.fn(async () => ({ ok: status < 400, status, json: async () => body })) as jest.Mock;
}

describe('server status line', () => {
  test('says the server and database answer, with the version from the API', async () => {
    mockFetch(200, { status: 'ok', version: '9.8.7', database: { ok: true }, jobs: { mode: 'threads', workers: 3 } });
    renderWithQuery(<ServerStatus />);
    expect(await screen.findByText(/Server and database answer · version 9\.8\.7/)).toBeTruthy();
  });

  test('passes on the server’s own explanation when the database is down', async () => {
    mockFetch(503, { error: { code: 'db-down', message: 'database file is locked' } });
    renderWithQuery(<ServerStatus />);
    expect(await screen.findByText(/Server unreachable: database file is locked/)).toBeTruthy();
  });

  test('refuses an answer that does not match the shared schema', async () => {
    mockFetch(200, { status: 'fine', version: 3 });
    renderWithQuery(<ServerStatus />);
    expect(await screen.findByText(/does not understand/)).toBeTruthy();
  });
});

describe('navigation highlighting', () => {
  test('a section is current on its own page and below it, the overview only on /', () => {
    expect(isCurrent('/networks', '/networks')).toBe(true);
    expect(isCurrent('/networks', '/networks/4/versions')).toBe(true);
    expect(isCurrent('/networks', '/networks-old')).toBe(false);
    expect(isCurrent('/', '/')).toBe(true);
    expect(isCurrent('/', '/audits')).toBe(false);
  });
});
