import { randomBytes } from 'node:crypto';
import { createServer, request as httpRequest, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import twilio from 'twilio';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { LOCAL_TWILIO_ACCOUNT_SID, LOCAL_TWILIO_FROM } from '../../server/config/config';
import { createTwilioFake, type TwilioFake } from '../../server/fakes/twilio/app';
import type { StoredMessage } from '../../server/fakes/twilio/inbox';
import { segmentCount } from '../../server/fakes/twilio/segments';
import {
  createSmsSender,
  createTwilioClient,
  verifyTwilioSignature,
} from '../../server/sms/sender';

/*
 * The local Twilio fake driven by the real twilio SDK through createSmsSender, with a small
 * receiver standing in for the app's webhooks. Every phone number is in Ofcom's drama range.
 */

const KEYHOLDER = '+447700900123';
const OTHER_KEYHOLDER = '+447700900456';
const authToken = randomBytes(16).toString('hex');

interface Received {
  url: string;
  signature: string | undefined;
  params: Record<string, string>;
}

let fake: TwilioFake;
let fakeServer: Server;
let fakeUrl: string;
let receiverServer: Server;
let receiverUrl: string;
const received: Received[] = [];

function listen(server: Server) {
  return new Promise<string>((resolve) =>
    server.listen(0, '127.0.0.1', () =>
      resolve(`http://127.0.0.1:${(server.address() as AddressInfo).port}`),
    ),
  );
}

async function close(server: Server) {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
}

beforeAll(async () => {
  // The app's side: records each webhook with the full URL it was posted to.
  const receiver = express();
  receiver.use(express.urlencoded({ extended: false }));
  receiver.post('/sms/status', (req, res) => {
    received.push({
      url: `${receiverUrl}${req.originalUrl}`,
      signature: req.get('x-twilio-signature'),
      params: req.body,
    });
    res.status(204).end();
  });
  receiver.post('/sms/inbound', (req, res) => {
    received.push({
      url: `${receiverUrl}${req.originalUrl}`,
      signature: req.get('x-twilio-signature'),
      params: req.body,
    });
    res.type('text/xml').send('<?xml version="1.0" encoding="UTF-8"?><Response></Response>');
  });
  receiverServer = createServer(receiver);
  receiverUrl = await listen(receiverServer);

  fakeServer = createServer();
  fakeUrl = await listen(fakeServer);
  fake = createTwilioFake({
    accountSid: LOCAL_TWILIO_ACCOUNT_SID,
    authToken,
    publicUrl: fakeUrl,
    inboundWebhookUrl: `${receiverUrl}/sms/inbound`,
    phoneNumber: LOCAL_TWILIO_FROM,
    statusStepMs: 10,
  });
  fakeServer.on('request', fake.app);
});

beforeEach(async () => {
  await fake.idle();
  fake.inbox.clear();
  received.length = 0;
});

afterAll(async () => {
  fake.close();
  await Promise.all([close(fakeServer), close(receiverServer)]);
});

function sender(overrides: { authToken?: string; accountSid?: string } = {}) {
  return createSmsSender({
    accountSid: overrides.accountSid ?? LOCAL_TWILIO_ACCOUNT_SID,
    authToken: overrides.authToken ?? authToken,
    from: LOCAL_TWILIO_FROM,
    apiBaseUrl: fakeUrl,
  });
}

/** The SDK's client as the sender makes it, for the calls the sender does not make. */
function sdkClient() {
  return createTwilioClient({
    accountSid: LOCAL_TWILIO_ACCOUNT_SID,
    authToken,
    apiBaseUrl: fakeUrl,
  });
}

function basicAuth(user: string, password: string) {
  return `Basic ${Buffer.from(`${user}:${password}`).toString('base64')}`;
}

const messagesUrl = () =>
  `${fakeUrl}/2010-04-01/Accounts/${LOCAL_TWILIO_ACCOUNT_SID}/Messages.json`;

describe('Twilio request signatures', () => {
  it("match the worked example Twilio's own libraries test against", () => {
    // twilio-python tests/unit/test_request_validator.py and twilio-php's validation docs:
    // auth token 12345, this URL and these parameters sign to RSOYDt4T1cUTdK1PDd93/VVr8B8=.
    // The numbers are the source's own, kept so the vector stays exact.
    const url = 'https://mycompany.com/myapp.php?foo=1&bar=2';
    const params = {
      CallSid: 'CA1234567890ABCDE',
      Caller: '+14158675309',
      Digits: '1234',
      From: '+14158675309',
      To: '+18005551212',
    };
    expect(twilio.getExpectedTwilioSignature('12345', url, params)).toBe(
      'RSOYDt4T1cUTdK1PDd93/VVr8B8=',
    );
    expect(verifyTwilioSignature('12345', url, params, 'RSOYDt4T1cUTdK1PDd93/VVr8B8=')).toBe(true);
    // Twilio's webhook security docs: the URL and every parameter are signed.
    expect(
      verifyTwilioSignature(
        '12345',
        url,
        { ...params, Digits: '9999' },
        'RSOYDt4T1cUTdK1PDd93/VVr8B8=',
      ),
    ).toBe(false);
    expect(
      verifyTwilioSignature(
        '12345',
        'https://mycompany.com/myapp.php?foo=1&bar=3',
        params,
        'RSOYDt4T1cUTdK1PDd93/VVr8B8=',
      ),
    ).toBe(false);
    expect(verifyTwilioSignature('12345', url, params, undefined)).toBe(false);
  });
});

describe('sending through the SDK', () => {
  it('stores the message and answers with the Messages resource the SDK reads', async () => {
    const sid = await sender().send({
      to: KEYHOLDER,
      body: 'Wardbook: alarm at site WB-0142. Can you attend? Reply YES or NO.',
    });
    expect(sid).toMatch(/^SM[0-9a-f]{32}$/);

    const stored = fake.inbox.get(sid)!;
    expect(stored).toMatchObject({
      from: LOCAL_TWILIO_FROM,
      to: KEYHOLDER,
      direction: 'outbound',
      numSegments: 1,
      statusCallback: null,
    });

    // Read back through the SDK: its MessageInstance parses what the fake answered.
    const fetched = await sdkClient().messages(sid).fetch();
    expect(fetched.sid).toBe(sid);
    expect(fetched.accountSid).toBe(LOCAL_TWILIO_ACCOUNT_SID);
    expect(fetched.to).toBe(KEYHOLDER);
    expect(fetched.from).toBe(LOCAL_TWILIO_FROM);
    expect(fetched.direction).toBe('outbound-api');
    expect(fetched.numSegments).toBe('1');
    expect(fetched.apiVersion).toBe('2010-04-01');
    expect(fetched.uri).toBe(
      `/2010-04-01/Accounts/${LOCAL_TWILIO_ACCOUNT_SID}/Messages/${sid}.json`,
    );
    // Dates in RFC 2822 as Twilio writes them, so the SDK turns them into real dates.
    expect(fetched.dateCreated).toBeInstanceOf(Date);
    expect(Number.isNaN(fetched.dateCreated.getTime())).toBe(false);
  });

  it('answers the create call with status queued, as Twilio does', async () => {
    const response = await fetch(messagesUrl(), {
      method: 'POST',
      headers: { Authorization: basicAuth(LOCAL_TWILIO_ACCOUNT_SID, authToken) },
      body: new URLSearchParams({ To: KEYHOLDER, From: LOCAL_TWILIO_FROM, Body: 'Test message' }),
    });
    expect(response.status).toBe(201);
    const resource = (await response.json()) as Record<string, unknown>;
    expect(resource).toMatchObject({
      status: 'queued',
      to: KEYHOLDER,
      from: LOCAL_TWILIO_FROM,
      body: 'Test message',
      num_media: '0',
      error_code: null,
      date_created: expect.stringMatching(
        /^[A-Z][a-z]{2}, \d{2} [A-Z][a-z]{2} \d{4} [\d:]{8} \+0000$/,
      ),
    });
    expect(response.headers.get('location')).toBe(resource.uri);
  });

  it('posts queued, sent and delivered to the StatusCallback in order, each signed', async () => {
    const statusCallback = `${receiverUrl}/sms/status?site=wb-0142`;
    const sid = await sender().send({ to: KEYHOLDER, body: 'Set-up check', statusCallback });

    const done = await fake.inbox.waitFor((m) => m.sid === sid && m.webhooks.length === 3);
    expect(done.status).toBe('delivered');
    expect(done.webhooks.map((w) => [w.status, w.responseStatus])).toEqual([
      ['queued', 204],
      ['sent', 204],
      ['delivered', 204],
    ]);

    const callbacks = received.filter((r) => r.params.MessageSid === sid);
    expect(callbacks.map((c) => c.params.MessageStatus)).toEqual(['queued', 'sent', 'delivered']);
    for (const callback of callbacks) {
      expect(callback.url).toBe(statusCallback);
      expect(callback.params).toMatchObject({
        AccountSid: LOCAL_TWILIO_ACCOUNT_SID,
        From: LOCAL_TWILIO_FROM,
        To: KEYHOLDER,
      });
      // The app's own check, twilio.validateRequest, accepts what the fake signed.
      expect(
        twilio.validateRequest(authToken, callback.signature!, callback.url, callback.params),
      ).toBe(true);
      expect(
        verifyTwilioSignature(authToken, callback.url, callback.params, callback.signature),
      ).toBe(true);
    }
  });

  it('a forged, altered or unsigned callback fails validation', async () => {
    const statusCallback = `${receiverUrl}/sms/status`;
    const sid = await sender().send({ to: KEYHOLDER, body: 'Set-up check', statusCallback });
    await fake.inbox.waitFor((m) => m.sid === sid && m.webhooks.length === 3);
    const genuine = received.find((r) => r.params.MessageStatus === 'delivered')!;
    expect(verifyTwilioSignature(authToken, genuine.url, genuine.params, genuine.signature)).toBe(
      true,
    );

    // Someone claiming a message was delivered when it was not.
    const altered = { ...genuine.params, MessageStatus: 'failed' };
    expect(verifyTwilioSignature(authToken, genuine.url, altered, genuine.signature)).toBe(false);
    // The same body sent to another URL.
    expect(
      verifyTwilioSignature(
        authToken,
        `${receiverUrl}/sms/other`,
        genuine.params,
        genuine.signature,
      ),
    ).toBe(false);
    // Signed with a token that is not ours.
    const forged = twilio.getExpectedTwilioSignature(
      randomBytes(16).toString('hex'),
      genuine.url,
      genuine.params,
    );
    expect(verifyTwilioSignature(authToken, genuine.url, genuine.params, forged)).toBe(false);
    // No signature at all.
    expect(verifyTwilioSignature(authToken, genuine.url, genuine.params, undefined)).toBe(false);
    expect(verifyTwilioSignature(authToken, genuine.url, genuine.params, '')).toBe(false);
  });

  it('counts parts the way a handset would be billed', async () => {
    // 3GPP TS 23.038/23.040 (from memory): 160 GSM 7-bit characters fit one part, 153 a part
    // after that; 70 UCS-2 units, then 67; €, [ and friends take two septets.
    expect(segmentCount('a'.repeat(160))).toBe(1);
    expect(segmentCount('a'.repeat(161))).toBe(2);
    expect(segmentCount('a'.repeat(306))).toBe(2);
    expect(segmentCount('a'.repeat(307))).toBe(3);
    expect(segmentCount('€'.repeat(80))).toBe(1);
    expect(segmentCount('€'.repeat(81))).toBe(2);
    expect(segmentCount('ł'.repeat(70))).toBe(1);
    expect(segmentCount('ł'.repeat(71))).toBe(2);

    const sid = await sender().send({ to: KEYHOLDER, body: `Łukasz ${'a'.repeat(70)}` });
    expect(fake.inbox.get(sid)!.numSegments).toBe(2);
  });
});

describe('what the API refuses', () => {
  it('wrong credentials: the SDK throws a RestException with the 401', async () => {
    const error = await sender({ authToken: randomBytes(16).toString('hex') })
      .send({ to: KEYHOLDER, body: 'Should not send' })
      .catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(twilio.RestException);
    expect(error).toMatchObject({ status: 401, code: 20003 });
    expect(fake.inbox.list()).toEqual([]);

    const raw = await fetch(messagesUrl(), {
      method: 'POST',
      body: new URLSearchParams({ To: KEYHOLDER, From: LOCAL_TWILIO_FROM, Body: 'x' }),
    });
    expect(raw.status).toBe(401);
    expect(await raw.json()).toMatchObject({ code: 20003, status: 401 });
  });

  it("another account's resources are not found, even with good credentials", async () => {
    const response = await fetch(
      `${fakeUrl}/2010-04-01/Accounts/AC${'0'.repeat(32)}/Messages.json`,
      { headers: { Authorization: basicAuth(LOCAL_TWILIO_ACCOUNT_SID, authToken) } },
    );
    expect(response.status).toBe(404);
    expect(await response.json()).toMatchObject({ code: 20404, status: 404 });
  });

  it('a To that is not E.164: 400 with code 21211, through the SDK and raw', async () => {
    const error = await sender()
      .send({ to: '07700 900123', body: 'Should not send' })
      .catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(twilio.RestException);
    expect(error).toMatchObject({ status: 400, code: 21211 });

    const raw = await fetch(messagesUrl(), {
      method: 'POST',
      headers: { Authorization: basicAuth(LOCAL_TWILIO_ACCOUNT_SID, authToken) },
      body: new URLSearchParams({ To: '447700900123', From: LOCAL_TWILIO_FROM, Body: 'x' }),
    });
    expect(raw.status).toBe(400);
    const body = (await raw.json()) as Record<string, unknown>;
    expect(body).toMatchObject({ code: 21211, status: 400 });
    expect(body.message).toContain('447700900123');
    expect(fake.inbox.list()).toEqual([]);
  });

  it('the other required fields', async () => {
    const post = (form: Record<string, string>) =>
      fetch(messagesUrl(), {
        method: 'POST',
        headers: { Authorization: basicAuth(LOCAL_TWILIO_ACCOUNT_SID, authToken) },
        body: new URLSearchParams(form),
      }).then(async (r) => ({
        status: r.status,
        code: ((await r.json()) as { code: number }).code,
      }));
    expect(await post({ From: LOCAL_TWILIO_FROM, Body: 'x' })).toEqual({
      status: 400,
      code: 21604,
    });
    expect(await post({ To: KEYHOLDER, Body: 'x' })).toEqual({ status: 400, code: 21603 });
    expect(await post({ To: KEYHOLDER, From: LOCAL_TWILIO_FROM })).toEqual({
      status: 400,
      code: 21602,
    });
    expect(await post({ To: KEYHOLDER, From: LOCAL_TWILIO_FROM, Body: 'x'.repeat(1601) })).toEqual({
      status: 400,
      code: 21617,
    });
    expect(
      await post({ To: KEYHOLDER, From: LOCAL_TWILIO_FROM, Body: 'x', StatusCallback: 'nope' }),
    ).toEqual({ status: 400, code: 21609 });
    // A Messaging Service sends from the account's number.
    expect(
      await post({ To: KEYHOLDER, MessagingServiceSid: `MG${'1'.repeat(32)}`, Body: 'x' }),
    ).toEqual({ status: 201, code: undefined });
    expect(fake.inbox.list()[0]!.from).toBe(LOCAL_TWILIO_FROM);
  });
});

describe('listing', () => {
  it('the SDK pages through the list, following next_page_uri back to the fake', async () => {
    const send = sender();
    const sids: string[] = [];
    for (const body of ['one', 'two', 'three']) sids.push(await send.send({ to: KEYHOLDER, body }));
    await send.send({ to: OTHER_KEYHOLDER, body: 'elsewhere' });

    const listed = await sdkClient().messages.list({ to: KEYHOLDER, pageSize: 2 });
    expect(listed.map((m) => m.sid)).toEqual([...sids].reverse());

    const response = await fetch(
      `${messagesUrl()}?PageSize=2&To=${encodeURIComponent(KEYHOLDER)}`,
      {
        headers: { Authorization: basicAuth(LOCAL_TWILIO_ACCOUNT_SID, authToken) },
      },
    );
    const page = (await response.json()) as Record<string, unknown>;
    expect(page).toMatchObject({ page: 0, page_size: 2, start: 0, previous_page_uri: null });
    expect(page.next_page_uri).toContain('Page=1');
  });

  it('/api/messages gives tests the inbox as JSON, newest first', async () => {
    const sid = await sender().send({ to: KEYHOLDER, body: 'Visible in JSON' });
    const list = (await (await fetch(`${fakeUrl}/api/messages`)).json()) as StoredMessage[];
    expect(list[0]).toMatchObject({ sid, to: KEYHOLDER, body: 'Visible in JSON' });
  });
});

describe('replies from keyholders', () => {
  it('replyAs posts a signed inbound SMS to the inbound webhook and records it', async () => {
    const reply = await fake.replyAs({ from: KEYHOLDER, body: 'YES, on my way' });
    expect(reply).toMatchObject({
      direction: 'inbound',
      status: 'received',
      from: KEYHOLDER,
      to: LOCAL_TWILIO_FROM,
    });
    expect(reply.sid).toMatch(/^SM[0-9a-f]{32}$/);
    expect(reply.webhooks).toEqual([
      expect.objectContaining({ url: `${receiverUrl}/sms/inbound`, responseStatus: 200 }),
    ]);

    const inbound = received.find((r) => r.params.MessageSid === reply.sid)!;
    expect(inbound.params).toMatchObject({
      MessageSid: reply.sid,
      AccountSid: LOCAL_TWILIO_ACCOUNT_SID,
      From: KEYHOLDER,
      To: LOCAL_TWILIO_FROM,
      Body: 'YES, on my way',
      NumMedia: '0',
    });
    expect(twilio.validateRequest(authToken, inbound.signature!, inbound.url, inbound.params)).toBe(
      true,
    );
    expect(
      verifyTwilioSignature(
        authToken,
        inbound.url,
        { ...inbound.params, Body: 'NO' },
        inbound.signature,
      ),
    ).toBe(false);
  });

  it('refuses a reply from something that is not a phone number', async () => {
    await expect(fake.replyAs({ from: 'not a number', body: 'hi' })).rejects.toThrow(/E\.164/);
    await expect(fake.replyAs({ from: KEYHOLDER, body: '   ' })).rejects.toThrow(/text/);
    expect(fake.inbox.list()).toEqual([]);
  });

  it('records an app that cannot be reached instead of failing', async () => {
    const closed = createServer();
    const deadUrl = await listen(closed);
    await close(closed);
    const lonely = createTwilioFake({
      accountSid: LOCAL_TWILIO_ACCOUNT_SID,
      authToken,
      inboundWebhookUrl: `${deadUrl}/inbound`,
    });
    const reply = await lonely.replyAs({ from: KEYHOLDER, body: 'Anyone there?' });
    expect(reply.webhooks[0]).toMatchObject({ responseStatus: null, error: 'ECONNREFUSED' });
    lonely.close();
  });
});

describe('the page', () => {
  it('lists conversations by number, escaped, each with a reply box', async () => {
    await sender().send({ to: KEYHOLDER, body: 'Alarm <b>set</b> & "checked"' });
    await fake.replyAs({ from: OTHER_KEYHOLDER, body: '<script>alert(1)</script>' });

    const response = await fetch(`${fakeUrl}/`);
    expect(response.headers.get('content-type')).toMatch(/^text\/html/);
    const page = await response.text();
    expect(page).toContain('Conversations (2)');
    expect(page).toContain(`Reply as ${KEYHOLDER}`);
    expect(page).toContain(`Reply as ${OTHER_KEYHOLDER}`);
    expect(page).toContain('Alarm &lt;b&gt;set&lt;/b&gt; &amp; &quot;checked&quot;');
    expect(page).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(page).not.toContain('<script>');
    expect(page).not.toContain('<b>set</b>');
  });

  it("the reply form posts the keyholder's reply to the app", async () => {
    await sender().send({ to: KEYHOLDER, body: 'Can you attend?' });
    const response = await fetch(`${fakeUrl}/replies`, {
      method: 'POST',
      redirect: 'manual',
      headers: { Origin: fakeUrl },
      body: new URLSearchParams({ from: KEYHOLDER, to: LOCAL_TWILIO_FROM, body: 'NO, away' }),
    });
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe(`/#conversation-${KEYHOLDER.slice(1)}`);
    const reply = fake.inbox.list().find((m) => m.direction === 'inbound')!;
    expect(reply).toMatchObject({ from: KEYHOLDER, body: 'NO, away' });
    expect(received.some((r) => r.params.MessageSid === reply.sid)).toBe(true);
  });

  it('takes the form as a browser sends it from the page: same-origin, Origin null', async () => {
    // The page sends no referrer, so Chromium posts its form with `Origin: null`; undici's
    // fetch will not set Sec-Fetch-Site, so this request goes through node:http.
    await sender().send({ to: KEYHOLDER, body: 'Can you attend?' });
    const body = new URLSearchParams({
      from: KEYHOLDER,
      to: LOCAL_TWILIO_FROM,
      body: '1',
    }).toString();
    const status = await new Promise<number>((resolve, reject) => {
      const req = httpRequest(
        `${fakeUrl}/replies`,
        {
          method: 'POST',
          headers: {
            'Content-Type': 'application/x-www-form-urlencoded',
            'Content-Length': Buffer.byteLength(body),
            Origin: 'null',
            'Sec-Fetch-Site': 'same-origin',
          },
        },
        (res) => {
          res.resume();
          resolve(res.statusCode ?? 0);
        },
      );
      req.on('error', reject);
      req.end(body);
    });
    expect(status).toBe(303);
    expect(fake.inbox.list().find((m) => m.direction === 'inbound')).toMatchObject({ body: '1' });
  });

  it('a form on another website cannot make the page post a reply', async () => {
    const response = await fetch(`${fakeUrl}/replies`, {
      method: 'POST',
      headers: { Origin: 'http://127.0.0.1:9', 'Sec-Fetch-Site': 'cross-site' },
      body: new URLSearchParams({ from: KEYHOLDER, body: 'YES' }),
    });
    expect(response.status).toBe(403);
    expect(fake.inbox.list()).toEqual([]);
  });

  it('POST /api/replies does the same for browser tests, which cannot call replyAs', async () => {
    const response = await fetch(`${fakeUrl}/api/replies`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ from: KEYHOLDER, body: 'YES' }),
    });
    expect(response.status).toBe(201);
    const reply = (await response.json()) as StoredMessage;
    expect(reply).toMatchObject({ direction: 'inbound', from: KEYHOLDER, to: LOCAL_TWILIO_FROM });
    expect(reply.webhooks[0]!.responseStatus).toBe(200);
  });
});
