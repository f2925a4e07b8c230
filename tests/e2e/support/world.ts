import type { Browser } from 'playwright-core';
import { launchBrowser } from './browser';
import { startTestServer } from './server';

export interface BrowserWorld {
  browser: Browser;
  server: Awaited<ReturnType<typeof startTestServer>>;
}

/**
 * Registers beforeAll/afterAll hooks that start a seeded server and Chromium
 * for the calling describe block; the returned object is filled in by then.
 */
export function useBrowserWorld(): BrowserWorld {
  const world = {} as BrowserWorld;
  beforeAll(async () => {
    world.server = await startTestServer();
    world.browser = await launchBrowser();
  });
  afterAll(async () => {
    await world.browser?.close();
    await world.server?.cleanup();
  });
  return world;
}
