import { execFile } from 'node:child_process';
import { existsSync } from 'node:fs';
import { promisify } from 'node:util';
import { chromium, type Browser } from 'playwright-core';

const run = promisify(execFile);
export const CHROMIUM = process.env.WARDBOOK_CHROMIUM ?? '/usr/bin/chromium';

/** Browser tests use Debian's Chromium; as root the test setup installs it when missing. */
export async function ensureChromium(): Promise<void> {
  if (existsSync(CHROMIUM)) return;
  const root = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!root || !existsSync('/usr/bin/apt-get')) {
    throw new Error(
      `Browser tests need Chromium at ${CHROMIUM}. Install Debian's package: sudo apt-get install -y chromium`,
    );
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  await run('apt-get', ['update', '-qq'], { env, maxBuffer: 1 << 26 });
  await run('apt-get', ['install', '-y', '-qq', 'chromium'], { env, maxBuffer: 1 << 26 });
}

export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      // Without these Chromium keeps calling home, and this machine's network refuses it.
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}
