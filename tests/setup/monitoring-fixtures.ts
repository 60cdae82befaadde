import type { Knex } from 'knex';
import { handleFrame } from '../../server/monitoring/receiver';
import { simulatedFrame } from '../../server/monitoring/simulator';

let sequence = 5000;

/** An intruder alarm from the site's panel, through the receiver's own handling; its event id. */
export async function alarmFromSite(db: Knex, siteId: string, zone = 1): Promise<string> {
  const site = await db('sites').where({ id: siteId }).first('monitoring_account');
  const frame = simulatedFrame({
    format: 'adm-cid',
    account: site.monitoring_account,
    code: '130',
    zone,
    partition: 1,
    qualifier: 'new',
    sequence: sequence++,
    receiver: '1',
    linePrefix: '1',
  });
  const { outcome } = await handleFrame({ db }, frame);
  if (!outcome.startsWith('ack:')) throw new Error(`the receiver answered ${outcome}`);
  const signal = await db('signals').where({ raw: frame }).first('event_id');
  return signal.event_id as string;
}
