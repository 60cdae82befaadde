import type { Browser } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { launchChromium } from './chromium';

/** One Chromium per test file, launched before its tests and closed after them. */
export function useChromium(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchChromium();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error('Chromium is not running yet');
    return browser;
  };
}
