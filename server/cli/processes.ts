import { spawn, type ChildProcess } from 'node:child_process';
import { createInterface } from 'node:readline';
import { prettyFactory } from 'pino-pretty';
import { repoRoot } from '../paths';

const pretty = prettyFactory({
  colorize: process.stdout.isTTY,
  ignore: 'pid,hostname,name,req,res,responseTime,reqId',
  translateTime: 'HH:MM:ss',
});

export interface ManagedProcess {
  name: string;
  child: ChildProcess;
  exited: Promise<number | null>;
}

/** Runs a TypeScript entry point under tsx, prefixing its output (pino JSON made readable). */
export function startProcess(name: string, entry: string, env: NodeJS.ProcessEnv): ManagedProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', entry], {
    cwd: repoRoot,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const label = `[${name}]`.padEnd(7);
  for (const stream of [child.stdout, child.stderr]) {
    createInterface({ input: stream! }).on('line', (line) => {
      const text = line.startsWith('{') ? safePretty(line) : line;
      process.stdout.write(`${label} ${text.trimEnd()}\n`);
    });
  }
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { name, child, exited };
}

function safePretty(line: string) {
  try {
    return pretty(line);
  } catch {
    return line;
  }
}

export async function stopProcess(managed: ManagedProcess, timeoutMs = 5000): Promise<void> {
  if (managed.child.exitCode !== null || managed.child.signalCode !== null) return;
  managed.child.kill('SIGTERM');
  const timer = setTimeout(() => managed.child.kill('SIGKILL'), timeoutMs);
  await managed.exited;
  clearTimeout(timer);
}

/** Polls a URL until it answers 2xx, or fails after the timeout. */
export async function waitForHttp(url: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let lastError = 'no answer';
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url, { signal: AbortSignal.timeout(2000) });
      if (response.ok) return;
      lastError = `HTTP ${response.status}`;
    } catch (error) {
      lastError = (error as Error).message;
    }
    await new Promise((resolve) => setTimeout(resolve, 150));
  }
  throw new Error(`${url} did not become ready within ${timeoutMs / 1000} s (${lastError})`);
}
