import twilio from 'twilio';
import type RequestClient from 'twilio/lib/base/RequestClient';
import type Response from 'twilio/lib/http/response';

export interface SmsSenderOptions {
  accountSid: string;
  authToken: string;
  /** An E.164 number, an alphanumeric sender ID, or a Messaging Service SID ("MG…"). */
  from: string;
  /**
   * Where the API lives when it is not Twilio's own (the local fake's origin). Every request
   * the SDK would make to a twilio.com host goes here instead, path and query unchanged.
   */
  apiBaseUrl?: string;
}

export interface OutgoingSms {
  /** E.164, e.g. +447700900123. */
  to: string;
  body: string;
  /** Twilio posts the message's delivery statuses here, signed. */
  statusCallback?: string;
}

export interface SmsSender {
  /** Hands the message to Twilio and resolves with its SID ("SM…"); rejects with the SDK's RestException. */
  send(sms: OutgoingSms): Promise<string>;
  /**
   * The SID of a message already sent to `to` whose text contains `marker`, if any. Twilio has
   * no idempotency key for messages, so after a crash mid-send this is how a sender learns
   * whether the provider took the message before sending it again.
   */
  findSent(to: string, marker: string): Promise<string | null>;
}

const TWILIO_HOST = /(^|\.)twilio\.com$/i;

/**
 * The SDK's own HTTP client with only the origin changed, plugged in through its documented
 * `httpClient` option: the SDK still builds the request (path, form encoding, Basic auth,
 * User-Agent) and reads the response, so nothing of it is imitated here.
 */
class RedirectedRequestClient extends twilio.RequestClient {
  private readonly base: string;

  constructor(apiBaseUrl: string) {
    super({ timeout: 15_000 });
    this.base = apiBaseUrl.replace(/\/+$/, '');
  }

  override request<TData>(opts: RequestClient.RequestOptions<TData>): Promise<Response<TData>> {
    const target = new URL(opts.uri);
    if (!TWILIO_HOST.test(target.hostname)) {
      // Only Twilio's own hosts are redirected; anything else is refused, never sent our token.
      return Promise.reject(new Error(`refusing to send a Twilio request to ${target.origin}`));
    }
    return super.request({ ...opts, uri: `${this.base}${target.pathname}${target.search}` });
  }
}

/** The twilio SDK's client, talking to `apiBaseUrl` when that is not Twilio's own API. */
export function createTwilioClient(
  options: Pick<SmsSenderOptions, 'accountSid' | 'authToken' | 'apiBaseUrl'>,
): twilio.Twilio {
  const redirect =
    options.apiBaseUrl && !TWILIO_HOST.test(new URL(options.apiBaseUrl).hostname)
      ? new RedirectedRequestClient(options.apiBaseUrl)
      : undefined;
  return twilio(options.accountSid, options.authToken, { httpClient: redirect, autoRetry: false });
}

export function createSmsSender(options: SmsSenderOptions): SmsSender {
  const client = createTwilioClient(options);
  const sender = options.from.startsWith('MG')
    ? { messagingServiceSid: options.from }
    : { from: options.from };

  return {
    async send({ to, body, statusCallback }) {
      const message = await client.messages.create({ ...sender, to, body, statusCallback });
      return message.sid;
    },
    async findSent(to, marker) {
      const recent = await client.messages.list({ to, limit: 100 });
      return recent.find((message) => message.body.includes(marker))?.sid ?? null;
    },
  };
}

/**
 * True when a webhook really came from Twilio (or the local fake, which signs the same way):
 * `url` is the full URL Twilio was given, query included, and `params` the form it posted.
 */
export function verifyTwilioSignature(
  authToken: string,
  url: string,
  params: Record<string, unknown>,
  signature: string | undefined,
): boolean {
  if (!signature) return false;
  return twilio.validateRequest(authToken, signature, url, params);
}
