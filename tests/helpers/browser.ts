/** Debian's Chromium driven by playwright-core (a fresh profile each launch), with the flags a closed network needs. */
import { chromium, type Browser } from 'playwright-core';

export const CHROMIUM_PATH = process.env.BONDMAP_CHROMIUM ?? '/usr/bin/chromium';

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}
