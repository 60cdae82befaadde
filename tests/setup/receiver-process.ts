import { createServer, type AddressInfo } from 'node:net';
import { startProcess, type ManagedProcess } from '../../server/cli/processes';
import type { DatabaseConnection } from '../../server/db/knex';

/** A port nothing is listening on now, for a child process to take. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

/**
 * The real alarm receiver process (`server/monitoring/receiver-main.ts`, as `npm start` runs
 * it) on the given database and DC-09 port; resolves once it says it is listening. Its HTTPS
 * intake gets a free port of its own, so it never meets a running `npm start`'s.
 */
export async function startReceiverProcess(options: {
  database: DatabaseConnection;
  port: number;
}): Promise<ManagedProcess> {
  if (options.database.host !== '127.0.0.1')
    throw new Error('the receiver reads PostgreSQL on 127.0.0.1 only');
  const receiver = startProcess('receiver', 'server/monitoring/receiver-main.ts', {
    NODE_ENV: 'test',
    WARDBOOK_LOG_LEVEL: 'info',
    WARDBOOK_PG_PORT: String(options.database.port),
    WARDBOOK_DB_NAME: options.database.database,
    WARDBOOK_RECEIVER_PORT: String(options.port),
    WARDBOOK_INTAKE_PORT: String(await freePort()),
  });
  await new Promise<void>((resolve, reject) => {
    let output = '';
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('DC-09 receiver listening')) {
        receiver.child.stdout!.off('data', onData);
        resolve();
      }
    };
    receiver.child.stdout!.on('data', onData);
    void receiver.exited.then((code) =>
      reject(new Error(`the receiver exited (code ${code}) before listening:\n${output}`)),
    );
  });
  return receiver;
}

/** Ends the process as a power cut or `kill -9` would: no shutdown handler runs. */
export async function killHard(receiver: ManagedProcess): Promise<void> {
  if (receiver.child.exitCode === null && receiver.child.signalCode === null)
    receiver.child.kill('SIGKILL');
  await receiver.exited;
}
