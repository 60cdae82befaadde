import { createHash, timingSafeEqual } from 'node:crypto';
import { setTimeout as sleep } from 'node:timers/promises';
import express, { type Express, type Request, type Response } from 'express';
import helmet from 'helmet';
import twilio from 'twilio';
import { Inbox, type MessageStatus, type StoredMessage } from './inbox';
import { renderConversations, renderProblem, PAGE_CSS } from './page';
import { segmentCount } from './segments';

export interface TwilioFakeOptions {
  accountSid: string;
  authToken: string;
  /** The fake's own origin, shown on its page as the SDK's base URL. */
  publicUrl?: string;
  /** The app's webhook for incoming SMS: replies are posted here, signed. */
  inboundWebhookUrl?: string;
  /** The account's number: replies go to it by default, and Messaging Service sends use it. */
  phoneNumber?: string;
  /** Pause before each delivery status (queued, sent, delivered). */
  statusStepMs?: number;
}

export interface Reply {
  from: string;
  /** The number replied to; the account's number if omitted. */
  to?: string;
  body: string;
}

export interface TwilioFake {
  app: Express;
  inbox: Inbox;
  /** A keyholder's phone texting in: recorded, then posted signed to the inbound webhook. */
  replyAs(reply: Reply): Promise<StoredMessage>;
  /** Resolves once every status callback already under way has been posted. */
  idle(): Promise<void>;
  /** Cancels the callbacks still to come. */
  close(): void;
}

export class ReplyError extends Error {}

const API_VERSION = '2010-04-01';
/** E.164: a plus, then up to 15 digits, not starting with 0 (ITU-T E.164). */
const E164 = /^\+[1-9]\d{1,14}$/;
/** An alphanumeric sender ID, as UK networks accept: up to 11 letters, digits and spaces. */
const ALPHANUMERIC_SENDER = /^(?=.*[A-Za-z])[A-Za-z0-9 ]{1,11}$/;
const MESSAGING_SERVICE_SID = /^MG[0-9a-f]{32}$/;
/** Twilio refuses longer bodies (its error 21617; from memory). */
const MAX_BODY = 1600;

/*
 * Error codes and words follow Twilio's published error dictionary, recalled from memory:
 * 20003 authenticate, 20404 not found, 21211 invalid To, 21212 invalid From, 21602 body
 * required, 21603 From required, 21604 To required, 21609 invalid StatusCallback, 21617 body
 * too long, 21701 unknown Messaging Service.
 */
interface TwilioError {
  status: number;
  code: number;
  message: string;
}

function sendError(res: Response, error: TwilioError) {
  res.status(error.status).json({
    code: error.code,
    message: error.message,
    more_info: `https://www.twilio.com/docs/errors/${error.code}`,
    status: error.status,
  });
}

/** Twilio's resources date in RFC 2822 ("Tue, 01 Dec 2026 10:15:00 +0000"). */
function rfc2822(iso: string | null) {
  return iso ? new Date(iso).toUTCString().replace('GMT', '+0000') : null;
}

/** One form field, as a string; a repeated field counts as its first value. */
function field(body: unknown, name: string): string | undefined {
  if (!body || typeof body !== 'object') return undefined;
  const value = (body as Record<string, unknown>)[name];
  const first = Array.isArray(value) ? value[0] : value;
  return typeof first === 'string' ? first : undefined;
}

function sameSecret(given: string, expected: string) {
  // Hashing first makes the comparison constant-time whatever the lengths.
  const digest = (value: string) => createHash('sha256').update(value).digest();
  return timingSafeEqual(digest(given), digest(expected));
}

function isHttpUrl(value: string) {
  try {
    const url = new URL(value);
    return url.protocol === 'http:' || url.protocol === 'https:';
  } catch {
    return false;
  }
}

/**
 * A local stand-in for Twilio's Programmable Messaging: the 2010-04-01 Messages resource with
 * HTTP Basic auth, delivery-status callbacks and inbound replies signed with X-Twilio-Signature,
 * and a page where a person plays the keyholder's phone. Nothing leaves the machine.
 */
export function createTwilioFake(options: TwilioFakeOptions): TwilioFake {
  const { accountSid, authToken } = options;
  const phoneNumber = options.phoneNumber ?? '+447700900000';
  const statusStepMs = options.statusStepMs ?? 50;
  const inbox = new Inbox();
  const stopping = new AbortController();
  const inFlight = new Set<Promise<void>>();
  const accountPath = `/${API_VERSION}/Accounts/${accountSid}`;

  const resourceUri = (sid: string) => `${accountPath}/Messages/${sid}.json`;
  const toResource = (message: StoredMessage) => ({
    account_sid: message.accountSid,
    api_version: API_VERSION,
    body: message.body,
    date_created: rfc2822(message.dateCreated),
    date_sent: rfc2822(message.dateSent),
    date_updated: rfc2822(message.dateUpdated),
    direction: message.direction === 'outbound' ? 'outbound-api' : 'inbound',
    error_code: null,
    error_message: null,
    from: message.from,
    messaging_service_sid: message.messagingServiceSid,
    num_media: '0',
    num_segments: String(message.numSegments),
    price: null,
    price_unit: 'USD',
    sid: message.sid,
    status: message.status,
    subresource_uris: {
      media: `${accountPath}/Messages/${message.sid}/Media.json`,
      feedback: `${accountPath}/Messages/${message.sid}/Feedback.json`,
    },
    to: message.to,
    uri: resourceUri(message.sid),
  });

  /** Posts form parameters signed the way Twilio signs its webhooks, and records the outcome. */
  async function postSigned(
    message: StoredMessage,
    url: string,
    params: Record<string, string>,
  ): Promise<void> {
    // The SDK's own signer: HMAC-SHA1 keyed with the auth token over the URL followed by each
    // parameter's name and value, sorted by name, in base64 (Twilio's webhook security docs).
    const signature = twilio.getExpectedTwilioSignature(authToken, url, params);
    const attempt = {
      url,
      status: message.status,
      at: new Date().toISOString(),
      responseStatus: null as number | null,
      error: null as string | null,
    };
    try {
      const response = await fetch(url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/x-www-form-urlencoded; charset=utf-8',
          'X-Twilio-Signature': signature,
          'User-Agent': 'Wardbook-Twilio-Fake/1.0',
        },
        body: new URLSearchParams(params),
        redirect: 'manual',
        signal: AbortSignal.any([stopping.signal, AbortSignal.timeout(10_000)]),
      });
      await response.arrayBuffer();
      attempt.responseStatus = response.status;
    } catch (error) {
      if (stopping.signal.aborted) return;
      const cause = (error as { cause?: { code?: string; message?: string } }).cause;
      attempt.error = cause?.code ?? cause?.message ?? (error as Error).message;
    }
    inbox.recordWebhook(message.sid, attempt);
  }

  /** queued → sent → delivered, a pause before each, each reported to the StatusCallback. */
  async function deliver(message: StoredMessage) {
    const steps: MessageStatus[] = ['queued', 'sent', 'delivered'];
    for (const status of steps) {
      try {
        await sleep(statusStepMs, undefined, { signal: stopping.signal });
      } catch {
        return;
      }
      inbox.setStatus(message.sid, status);
      if (!message.statusCallback) continue;
      await postSigned(message, message.statusCallback, {
        AccountSid: accountSid,
        ApiVersion: API_VERSION,
        From: message.from,
        MessageSid: message.sid,
        MessageStatus: status,
        SmsSid: message.sid,
        SmsStatus: status,
        To: message.to,
      });
      if (stopping.signal.aborted) return;
    }
  }

  function track(work: Promise<void>) {
    inFlight.add(work);
    void work.finally(() => inFlight.delete(work));
  }

  async function replyAs(reply: Reply): Promise<StoredMessage> {
    const from = reply.from.trim();
    const to = (reply.to ?? phoneNumber).trim();
    if (!E164.test(from))
      throw new ReplyError(`${from || 'An empty number'} is not a number in E.164 form.`);
    if (!E164.test(to))
      throw new ReplyError(`${to || 'An empty number'} is not a number in E.164 form.`);
    if (!reply.body.trim()) throw new ReplyError('A reply needs some text.');
    if (reply.body.length > MAX_BODY)
      throw new ReplyError(`A reply may be at most ${MAX_BODY} characters.`);
    const message = inbox.add({
      accountSid,
      messagingServiceSid: null,
      from,
      to,
      body: reply.body,
      numSegments: segmentCount(reply.body),
      status: 'received',
      direction: 'inbound',
      statusCallback: null,
    });
    if (options.inboundWebhookUrl) {
      await postSigned(message, options.inboundWebhookUrl, {
        AccountSid: accountSid,
        ApiVersion: API_VERSION,
        Body: message.body,
        From: message.from,
        MessageSid: message.sid,
        NumMedia: '0',
        NumSegments: String(message.numSegments),
        SmsMessageSid: message.sid,
        SmsSid: message.sid,
        SmsStatus: 'received',
        To: message.to,
      });
    }
    return message;
  }

  const app = express();
  app.disable('x-powered-by');
  app.use(
    helmet({
      strictTransportSecurity: false,
      contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } },
    }),
  );
  app.use(express.urlencoded({ extended: false, limit: '64kb' }));

  // --- The REST API, as the twilio SDK calls it ---------------------------------------------

  const api = express.Router();
  api.use((req, res, next) => {
    const header = req.get('authorization') ?? '';
    const [scheme, encoded] = header.split(' ');
    const decoded =
      scheme?.toLowerCase() === 'basic' && encoded
        ? Buffer.from(encoded, 'base64').toString('utf8')
        : '';
    const colon = decoded.indexOf(':');
    const username = colon === -1 ? '' : decoded.slice(0, colon);
    const password = colon === -1 ? '' : decoded.slice(colon + 1);
    if (!sameSecret(username, accountSid) || !sameSecret(password, authToken)) {
      res.set('WWW-Authenticate', 'Basic realm="Twilio API"');
      sendError(res, { status: 401, code: 20003, message: 'Authenticate' });
      return;
    }
    next();
  });
  const notFound = (req: Request, res: Response) =>
    sendError(res, {
      status: 404,
      code: 20404,
      message: `The requested resource ${req.originalUrl.split('?')[0]} was not found`,
    });
  // Credentials for one account do not reach another's resources.
  api.use('/Accounts/:accountSid', (req, res, next) => {
    if (req.params.accountSid !== accountSid) notFound(req, res);
    else next();
  });

  api.post('/Accounts/:accountSid/Messages.json', (req, res) => {
    const to = field(req.body, 'To')?.trim();
    const from = field(req.body, 'From')?.trim();
    const messagingServiceSid = field(req.body, 'MessagingServiceSid')?.trim();
    const body = field(req.body, 'Body') ?? '';
    const statusCallback = field(req.body, 'StatusCallback')?.trim();

    const invalid = (code: number, message: string) =>
      sendError(res, { status: 400, code, message });
    if (!to) return invalid(21604, "A 'To' phone number is required.");
    if (!E164.test(to)) return invalid(21211, `The 'To' number ${to} is not a valid phone number.`);
    if (!from && !messagingServiceSid) return invalid(21603, "A 'From' phone number is required.");
    if (from && !E164.test(from) && !ALPHANUMERIC_SENDER.test(from))
      return invalid(
        21212,
        `The 'From' number ${from} is not a valid phone number, shortcode, or alphanumeric sender ID.`,
      );
    if (!from && messagingServiceSid && !MESSAGING_SERVICE_SID.test(messagingServiceSid))
      return invalid(21701, `The Messaging Service Sid ${messagingServiceSid} is invalid.`);
    if (!body) return invalid(21602, 'Message body is required.');
    if (body.length > MAX_BODY)
      return invalid(
        21617,
        `The concatenated message body exceeds the ${MAX_BODY} character limit.`,
      );
    if (statusCallback && !isHttpUrl(statusCallback))
      return invalid(21609, `The StatusCallback URL ${statusCallback} is not a valid URL.`);

    const message = inbox.add({
      accountSid,
      messagingServiceSid: messagingServiceSid ?? null,
      from: from ?? phoneNumber,
      to,
      body,
      numSegments: segmentCount(body),
      status: 'queued',
      direction: 'outbound',
      statusCallback: statusCallback ?? null,
    });
    track(deliver(message));
    res.status(201).location(resourceUri(message.sid)).json(toResource(message));
  });

  api.get('/Accounts/:accountSid/Messages.json', (req, res) => {
    const query = req.query as Record<string, unknown>;
    const to = field(query, 'To');
    const from = field(query, 'From');
    const pageSize = Math.min(Math.max(Number(field(query, 'PageSize') ?? 50) || 50, 1), 1000);
    const page = Math.max(Math.trunc(Number(field(query, 'Page') ?? 0)) || 0, 0);
    const matching = inbox
      .list()
      .filter((message) => (!to || message.to === to) && (!from || message.from === from));
    const start = page * pageSize;
    const pageUri = (n: number) => {
      const search = new URLSearchParams();
      if (to) search.set('To', to);
      if (from) search.set('From', from);
      search.set('PageSize', String(pageSize));
      search.set('Page', String(n));
      return `${accountPath}/Messages.json?${search}`;
    };
    const slice = matching.slice(start, start + pageSize);
    res.json({
      messages: slice.map(toResource),
      end: start + Math.max(slice.length - 1, 0),
      first_page_uri: pageUri(0),
      next_page_uri: start + pageSize < matching.length ? pageUri(page + 1) : null,
      page,
      page_size: pageSize,
      previous_page_uri: page > 0 ? pageUri(page - 1) : null,
      start,
      uri: pageUri(page),
    });
  });

  api.get('/Accounts/:accountSid/Messages/:sid.json', (req, res) => {
    const message = inbox.get(req.params.sid);
    if (!message) notFound(req, res);
    else res.json(toResource(message));
  });
  api.use(notFound);
  app.use(`/${API_VERSION}`, api);

  // --- The page and JSON for people and tests -------------------------------------------------

  /**
   * The page's forms post a signed reply to the app, so a form on some other website must not
   * be able to make this browser do it: only this page's own origin may post.
   */
  const fromThisPage = (req: Request) => {
    // Browsers say where a request comes from in Sec-Fetch-Site. The page sends no referrer,
    // so a form post from it carries `Origin: null`: the Origin check is only for clients
    // that do not send Sec-Fetch-Site.
    const site = req.get('sec-fetch-site');
    if (site) return site === 'same-origin' || site === 'none';
    const origin = req.get('origin');
    return !origin || origin === `${req.protocol}://${req.get('host')}`;
  };

  app.get('/fake.css', (_req, res) => {
    res.type('css').send(PAGE_CSS);
  });
  app.get('/api/messages', (_req, res) => {
    res.json(inbox.list());
  });
  app.delete('/api/messages', (req, res) => {
    if (!fromThisPage(req)) return void res.status(403).json({ error: 'cross-site request' });
    inbox.clear();
    res.status(204).end();
  });
  app.post('/api/replies', express.json({ limit: '16kb' }), async (req, res) => {
    if (!fromThisPage(req)) return void res.status(403).json({ error: 'cross-site request' });
    try {
      const message = await replyAs({
        from: field(req.body, 'from') ?? '',
        to: field(req.body, 'to'),
        body: field(req.body, 'body') ?? '',
      });
      res.status(201).json(message);
    } catch (error) {
      if (!(error instanceof ReplyError)) throw error;
      res.status(400).json({ error: error.message });
    }
  });
  app.post('/replies', async (req, res) => {
    if (!fromThisPage(req)) {
      res.status(403).type('html').send(renderProblem('This form can only be sent from its page.'));
      return;
    }
    try {
      const message = await replyAs({
        from: field(req.body, 'from') ?? '',
        to: field(req.body, 'to') || undefined,
        body: field(req.body, 'body') ?? '',
      });
      res.redirect(303, `/#conversation-${message.from.slice(1)}`);
    } catch (error) {
      if (!(error instanceof ReplyError)) throw error;
      res.status(400).type('html').send(renderProblem(error.message));
    }
  });
  app.get('/', (_req, res) => {
    res.type('html').send(
      renderConversations(inbox.list(), {
        phoneNumber,
        apiBaseUrl: options.publicUrl,
        inboundWebhookUrl: options.inboundWebhookUrl,
      }),
    );
  });

  return {
    app,
    inbox,
    replyAs,
    async idle() {
      while (inFlight.size > 0) await Promise.all([...inFlight]);
    },
    close() {
      stopping.abort();
    },
  };
}
