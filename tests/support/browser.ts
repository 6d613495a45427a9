import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** Debian's Chromium, headless, with the flags that keep it off the (closed) network. */
export async function launchBrowser(): Promise<{ context: BrowserContext; close(): Promise<void> }> {
  const profile = mkdtempSync(path.join(os.tmpdir(), 'femtoslot-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1360, height: 860 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'],
  });
  return {
    context,
    close: async () => { await context.close(); rmSync(profile, { recursive: true, force: true }); },
  };
}

/** Full page by default; `fullPage: false` for pages whose length grows with the shared test database (lists of every configuration). */
export async function screenshot(page: Page, name: string, options: { fullPage?: boolean } = {}): Promise<string> {
  const dir = path.join(process.env.ARTIFACTS_DIR ?? path.join(process.cwd(), 'artifacts'), 'screenshots');
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: options.fullPage ?? true });
  return file;
}

export async function signInThroughForm(page: Page, baseUrl: string, email: string, password = 'femtoslot-demo'): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.fill('input[name="email"]', email);
  await page.fill('input[name="password"]', password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 15_000 });
}
