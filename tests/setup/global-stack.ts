import path from 'node:path';
import { build } from 'vite';
import type { TestProject } from 'vitest/node';
import { loadConfig } from '../../server/config/config';
import { repoRoot } from '../../server/paths';
import { ensureChromium } from './chromium';
import { startStack } from './stack';
import './provided';

/**
 * For browser tests: builds the client as `npm start` does, then runs the mail catcher, IdP
 * and API (serving that build) on free ports for the whole run. Chromium is installed if
 * missing.
 */
export default async function setup(project: TestProject) {
  const clientDir = path.join(
    loadConfig({ ...process.env, NODE_ENV: 'test' }).dataDir,
    'e2e-client',
  );
  // Vitest sets NODE_ENV=test, which would make Vite bundle React's development build.
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  await Promise.all([
    ensureChromium(),
    build({
      root: repoRoot,
      configFile: path.join(repoRoot, 'vite.config.ts'),
      logLevel: 'warn',
      build: { outDir: clientDir, emptyOutDir: true },
    }),
  ]).finally(() => {
    process.env.NODE_ENV = nodeEnv;
  });
  const stack = await startStack({
    database: project.getProvidedContext().database,
    clientDir,
    // Every browser test signs in from 127.0.0.1; the sign-in limit per address and window is
    // for people, and has its own test (tests/api/sign-in-flow.test.ts).
    attemptsPerWindow: 1000,
  });
  project.provide('stack', {
    apiUrl: stack.apiUrl,
    idpUrl: stack.idpUrl,
    mailUrl: stack.mailUrl,
    smsUrl: stack.smsUrl,
  });
  return () => stack.stop();
}
