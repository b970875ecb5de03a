// Headless Chromium from Debian's `chromium` package, driven by playwright-core, for the system tests.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

/** Where Debian's chromium package installs the browser. */
export const CHROMIUM_PATH = '/usr/bin/chromium';

/** The flags the suite runs Chromium with: headless, and nothing that reaches the network by itself. */
export const CHROMIUM_FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

/** A browser with a fresh profile in a temporary folder; `close` ends it and removes the profile. */
export async function openChromium(options: { javaScriptEnabled?: boolean } = {}): Promise<{ context: BrowserContext; close: () => Promise<void> }> {
  // playwright-core takes the profile folder (Chromium's --user-data-dir) as this call's first argument.
  const profile = mkdtempSync(path.join(tmpdir(), 'isapart-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    args: CHROMIUM_FLAGS,
    headless: true,
    viewport: { width: 1280, height: 900 },
    javaScriptEnabled: options.javaScriptEnabled ?? true,
  });
  // Nothing but the report's own file may load; any other request fails the page, so the tests would see it.
  await context.route(/^(?!file:)/, (route) => route.abort());
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
