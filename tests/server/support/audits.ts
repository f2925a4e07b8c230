import type { AccountsWorld } from './accounts';
import { signedIn } from './accounts';

export type Agent = Awaited<ReturnType<typeof signedIn>>;

export async function networkIdByName(agent: Agent, name: string): Promise<number> {
  const res = await agent.get(`/api/v1/networks?q=${encodeURIComponent(name)}`);
  const found = res.body.networks.find((n: { name: string }) => n.name === name);
  if (!found) throw new Error(`no network named ${name}`);
  return found.id;
}

/** Polls an audit until it leaves queued/sweeping (the sweep runs on the test's own thread). */
export async function waitForSweep(agent: Agent, auditId: number, timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/v1/audits/${auditId}`);
    if (!['queued', 'sweeping'].includes(res.body.state)) return res.body;
    if (Date.now() > until) throw new Error(`audit ${auditId} still ${res.body.state}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

export async function startAndFinish(w: AccountsWorld, agent: Agent, networkName: string, settings?: object) {
  const networkId = await networkIdByName(agent, networkName);
  const res = await agent.post('/api/v1/audits').send({ networkId, version: 1, ...(settings ? { settings } : {}) });
  if (res.status !== 201) throw new Error(`start answered ${res.status}: ${JSON.stringify(res.body)}`);
  return waitForSweep(agent, res.body.id);
}
