import type { AddressInfo } from 'node:net';
import type { Knex } from 'knex';
import { createLogger } from '../../server/http/logger';
import { createSignalReceiver } from '../../server/monitoring/receiver';
import { simulatedFrame, type SimulatedSignal } from '../../server/monitoring/simulator';
import { isAckFor, openPanelLink, type PanelLink } from './panel-link';

export interface TestReceiver {
  /**
   * Sends one panel event over TCP as a DC-09 frame and waits for the ACK, which the receiver
   * gives only once the signal is committed. Resolves with the event it was filed under, if any.
   */
  send(signal: Omit<SimulatedSignal, 'receiver' | 'linePrefix'>): Promise<string | null>;
  stop(): Promise<void>;
}

/**
 * The real DC-09 receiver on a free loopback port, and one panel's link to it. Frames are
 * encrypted when the site has a DC-09 key, as its panel would be set up to.
 */
export async function startTestReceiver(db: Knex): Promise<TestReceiver> {
  const server = createSignalReceiver({ db, logger: createLogger('silent', 'test-receiver') });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const link: PanelLink = await openPanelLink((server.address() as AddressInfo).port);
  return {
    async send(signal) {
      const full: SimulatedSignal = { ...signal, receiver: '1', linePrefix: '1' };
      // A panel set up for encryption sends with its account's key, as the real one would.
      const site = await db('sites')
        .where({ monitoring_account: signal.account })
        .first('dc09_key');
      const frame = simulatedFrame(full, new Date(), site?.dc09_key ?? undefined);
      const reply = await link.send(frame);
      if (!isAckFor(reply, full)) throw new Error(`the receiver did not ACK: ${reply}`);
      const stored = await db('signals').where({ raw: frame }).first('event_id');
      return (stored?.event_id as string | null) ?? null;
    },
    async stop() {
      link.close();
      await new Promise((resolve) => server.close(resolve));
    },
  };
}
