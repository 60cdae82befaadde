import { readFileSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { loadConfig } from '../config/config';
import { DC09_KEY_PATTERN } from '../monitoring/credentials/schema';
import {
  contactIdMessage,
  describeReply,
  postToIntake,
  sendFrame,
  simulatedFrame,
  type SimulatedSignal,
} from '../monitoring/simulator';

// `npm run simulate -- --account 1000 --code 130 --zone 3`: sends the DC-09 frame a panel would
// send to the local receiver and prints the frame and the reply. Local testing only.
const { values } = parseArgs({
  options: {
    host: { type: 'string', default: '127.0.0.1' },
    port: { type: 'string', default: process.env.WARDBOOK_RECEIVER_PORT ?? '7100' },
    account: { type: 'string', default: '1000' },
    format: { type: 'string', default: 'adm-cid' },
    code: { type: 'string' },
    zone: { type: 'string', default: '1' },
    partition: { type: 'string', default: '1' },
    restore: { type: 'boolean', default: false },
    sequence: { type: 'string' },
    key: { type: 'string' },
    https: { type: 'boolean', default: false },
    token: { type: 'string' },
    'intake-port': { type: 'string', default: process.env.WARDBOOK_INTAKE_PORT ?? '7443' },
    help: { type: 'boolean', default: false },
  },
});

const USAGE = `Usage: npm run simulate -- [options]
  --account <hex>      monitoring account (default 1000, the demo's Marsh residence)
  --format <f>         adm-cid (Contact ID, default), sia-dcs, or null (a link test)
  --code <code>        Contact ID event code (default 130 burglary) or SIA code (default BA)
  --zone <n>           zone number (default 1)
  --partition <n>      partition or area (default 1)
  --restore            send the restore instead of the new event
  --sequence <n>       sequence number (default: from the clock)
  --key <hex>          the account's DC-09 AES key (32, 48 or 64 hex digits): sends the
                       encrypted frame and decrypts the reply
  --https --token <t>  posts the event to the HTTPS intake instead, with the site's intake
                       token (--intake-port, default 7443)
  --host, --port       receiver address (default 127.0.0.1:7100)`;

if (values.help) {
  console.error(USAGE);
  process.exit(0);
}
const format = values.format as SimulatedSignal['format'];
if (!['adm-cid', 'sia-dcs', 'null'].includes(format)) {
  console.error(`Unknown --format ${values.format}.\n${USAGE}`);
  process.exit(1);
}
const account = values.account!.toUpperCase();
if (!/^[0-9A-F]{3,16}$/.test(account)) {
  console.error('--account is 3 to 16 characters, each 0–9 or A–F.');
  process.exit(1);
}
const code = (values.code ?? (format === 'sia-dcs' ? 'BA' : '130')).toUpperCase();
if (format === 'adm-cid' && !/^\d{3}$/.test(code)) {
  console.error('--code for Contact ID is three digits, e.g. 130 (burglary) or 602 (test).');
  process.exit(1);
}
if (format === 'sia-dcs' && !/^[A-Z]{2}$/.test(code)) {
  console.error('--code for SIA-DCS is two letters, e.g. BA (burglary) or FA (fire).');
  process.exit(1);
}
const signal: SimulatedSignal = {
  format,
  account,
  code,
  zone: Number(values.zone),
  partition: Number(values.partition),
  qualifier: values.restore ? 'restore' : 'new',
  sequence: values.sequence ? Number(values.sequence) : Math.floor(Date.now() / 1000) % 10_000,
  receiver: '1',
  linePrefix: '1',
};
const key = values.key?.toUpperCase();
if (key !== undefined && !DC09_KEY_PATTERN.test(key)) {
  console.error('--key is 32, 48 or 64 hex digits (AES-128, AES-192 or AES-256).');
  process.exit(1);
}

if (values.https) {
  if (!values.token || format === 'null') {
    console.error(
      '--https needs --token <the site’s intake token>, and an event (not --format null).',
    );
    process.exit(1);
  }
  const certPath = path.join(loadConfig().dataDir, 'intake-tls', 'cert.pem');
  let ca: string;
  try {
    ca = readFileSync(certPath, 'utf8');
  } catch {
    console.error(`No intake certificate at ${certPath}: start Wardbook (npm start) first.`);
    process.exit(1);
  }
  try {
    const reply = await postToIntake(signal, {
      host: values.host!,
      port: Number(values['intake-port']),
      token: values.token,
      ca,
    });
    console.log(`reply    ${reply.status} ${JSON.stringify(reply.body)}`);
    process.exit(reply.status < 300 ? 0 : 1);
  } catch (error) {
    console.error(`Could not reach the intake: ${(error as Error).message}`);
    process.exit(1);
  }
}

const frame = simulatedFrame(signal, new Date(), key);
console.log(`sending  ${JSON.stringify(frame)}${key ? ' (encrypted)' : ''}`);
if (format === 'adm-cid')
  console.log(`(as a Contact ID line message: ${contactIdMessage(signal)})`);
try {
  const reply = await sendFrame(frame, { host: values.host!, port: Number(values.port) });
  console.log(`reply    ${JSON.stringify(reply)}`);
  console.log(`         ${describeReply(reply, key)}`);
} catch (error) {
  console.error(`Could not reach the receiver: ${(error as Error).message}`);
  process.exit(1);
}
