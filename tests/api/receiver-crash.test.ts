import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { stopProcess, type ManagedProcess } from '../../server/cli/processes';
import { simulatedFrame, type SimulatedSignal } from '../../server/monitoring/simulator';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation } from '../setup/factories';
import { everydaySignal, isAckFor, openPanelLink, type PanelLink } from '../setup/panel-link';
import { freePort, killHard, startReceiverProcess } from '../setup/receiver-process';
import { createSiteRecord } from '../setup/site-fixtures';

/**
 * The receiver's promise is that an ACK means the signal is stored: a panel that has its ACK
 * never sends again, so an acknowledged signal lost in a crash would be an alarm nobody sees.
 * This kills the real receiver process mid-burst (SIGKILL: no shutdown code runs), starts it
 * again, lets the panels resend what they hold, and counts what the database kept.
 */
const PANELS = 20;
/** Of the panels, these many use accounts no site holds (kept and flagged, never dropped). */
const UNKNOWN_PANELS = 4;
const SIGNALS_PER_PANEL = 100;
const TOTAL = PANELS * SIGNALS_PER_PANEL;
const KILL_AFTER_ACKS = 700;
/** Frames a panel has on the wire at once, so the kill lands with several in flight. */
const IN_FLIGHT_PER_PANEL = 4;
/** One in this many acknowledged frames is sent again too: a panel that missed its ACK. */
const RESEND_ONE_ACKED_IN = 10;

const db = testDb();
const database = inject('database');
let accounts: string[];
let receiver: ManagedProcess | undefined;

beforeAll(async () => {
  const installer = await createOrganisation(db, 'installer');
  const centre = await createOrganisation(db, 'monitoring_centre');
  const known: string[] = [];
  for (let index = 0; index < PANELS - UNKNOWN_PANELS; index++) {
    const { siteId } = await createSiteRecord(db, {
      installerId: installer.id,
      monitoringCentreId: centre.id,
    });
    const site = await db('sites').where({ id: siteId }).first('monitoring_account');
    known.push(site.monitoring_account as string);
  }
  const unknown = Array.from({ length: UNKNOWN_PANELS }, () =>
    randomBytes(4).toString('hex').toUpperCase(),
  );
  accounts = [...known, ...unknown];
});

afterAll(async () => {
  if (receiver) await stopProcess(receiver);
  await closeTestDb();
});

const keyOf = (signal: Pick<SimulatedSignal, 'account' | 'sequence'>) =>
  `${signal.account}/${String(signal.sequence).padStart(4, '0')}`;

/**
 * Sends the panel's frames over one connection, a few in flight, until all are answered or the
 * link drops. Each frame is built as it is sent: a resend carries the same sequence number and
 * data as before but the time of sending, as a panel's would.
 */
async function sendAll(
  link: PanelLink,
  signals: SimulatedSignal[],
  onAck: (signal: SimulatedSignal) => void,
  onOtherReply: (reply: string) => void,
): Promise<void> {
  let next = 0;
  const sender = async () => {
    while (next < signals.length) {
      const signal = signals[next++]!;
      let reply: string;
      try {
        reply = await link.send(simulatedFrame(signal));
      } catch {
        return; // The link dropped: whatever has no ACK stays with the panel.
      }
      if (isAckFor(reply, signal)) onAck(signal);
      else onOtherReply(reply);
    }
  };
  await Promise.all(Array.from({ length: IN_FLIGHT_PER_PANEL }, sender));
  link.close();
}

/** How many rows `signals` holds for each (account, sequence) of this test's panels. */
async function storedCounts(): Promise<Map<string, number>> {
  const rows: { account: string; sequence: string; copies: number }[] = await db('signals')
    .whereIn('account', accounts)
    .groupBy('account', 'sequence')
    .select('account', 'sequence', db.raw('count(*)::int as copies'));
  return new Map(rows.map((row) => [`${row.account}/${row.sequence}`, row.copies]));
}

describe('the receiver killed during a burst', () => {
  it('keeps every acknowledged signal, and after the panels resend holds all 2,000 exactly once', async () => {
    const port = await freePort();
    const panels = accounts.map((account) =>
      Array.from({ length: SIGNALS_PER_PANEL }, (_, index) => everydaySignal(account, index + 1)),
    );
    const acked = new Set<string>();
    const otherReplies: string[] = [];

    receiver = await startReceiverProcess({ database, port });
    const firstLife = receiver;
    const links = await Promise.all(accounts.map(() => openPanelLink(port)));
    await Promise.all(
      panels.map((signals, index) =>
        sendAll(
          links[index]!,
          signals,
          (signal) => {
            acked.add(keyOf(signal));
            if (acked.size === KILL_AFTER_ACKS) firstLife.child.kill('SIGKILL');
          },
          (reply) => otherReplies.push(reply),
        ),
      ),
    );
    await killHard(firstLife);

    // The crash came part-way: some acknowledged, some not.
    expect(acked.size).toBeGreaterThanOrEqual(KILL_AFTER_ACKS);
    expect(acked.size).toBeLessThan(TOTAL);
    expect(otherReplies).toEqual([]);
    const afterCrash = await storedCounts();
    const ackedButMissing = [...acked].filter((key) => afterCrash.get(key) !== 1);
    expect(ackedButMissing).toEqual([]);
    // Stored but not acknowledged is allowed (committed, then killed before the ACK left).
    expect(afterCrash.size).toBeGreaterThanOrEqual(acked.size);
    expect([...afterCrash.values()].every((copies) => copies === 1)).toBe(true);

    receiver = await startReceiverProcess({ database, port });
    let ackedThenResent = 0;
    const resends = panels.map((signals) =>
      signals.filter((signal, index) => {
        if (!acked.has(keyOf(signal))) return true;
        if (index % RESEND_ONE_ACKED_IN !== 0) return false;
        ackedThenResent++;
        return true;
      }),
    );
    expect(ackedThenResent).toBeGreaterThan(0);
    const resendLinks = await Promise.all(accounts.map(() => openPanelLink(port)));
    const resendAcked = new Set<string>();
    await Promise.all(
      resends.map((signals, index) =>
        sendAll(
          resendLinks[index]!,
          signals,
          (signal) => resendAcked.add(keyOf(signal)),
          (reply) => otherReplies.push(reply),
        ),
      ),
    );
    await stopProcess(receiver);
    receiver = undefined;

    expect(otherReplies).toEqual([]);
    expect(resendAcked.size).toBe(resends.flat().length);
    const final = await storedCounts();
    const everySignal = panels.flat().map(keyOf);
    const notExactlyOnce = everySignal.filter((key) => final.get(key) !== 1);
    expect(notExactlyOnce).toEqual([]);
    expect(final.size).toBe(TOTAL);
    const rows = await db('signals').whereIn('account', accounts).count<{ n: number }[]>('* as n');
    expect(rows[0]!.n).toBe(TOTAL);

    // Nor did a resend reach the operators twice: each intruder alarm sent is one line on its
    // event's timeline (opened, confirmed or repeated), however often the panel sent it.
    const alarmsSent = panels
      .flat()
      .filter((signal) => signal.code === '130' && signal.qualifier === 'new').length;
    const timeline = await db('event_timeline as t')
      .join('alarm_events as e', 'e.id', 't.event_id')
      .whereIn('e.account', accounts)
      .where('e.category', 'burglary')
      .whereIn('t.kind', ['received', 'confirmed', 'signal'])
      .count<{ n: number }[]>('* as n');
    expect(timeline[0]!.n).toBe(alarmsSent);
  }, 180_000);
});
