import express, { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import twilio from 'twilio';
import { ForbiddenError } from '../../http/errors';
import { parseRequest } from '../../http/validate';
import { verifyTwilioSignature } from '../../sms/sender';
import { notifyChange } from '../live';
import { readKeyholderReply } from './compose';
import { inboundMessageSchema, statusCallbackQuerySchema, statusCallbackSchema } from './schema';
import { escalateIfUnanswered, messageAnsweredBy, recordKeyholderReply } from './service';

export interface TwilioWebhookDeps {
  db: Knex;
  logger: Logger;
  /** Without it no request can be verified, so every webhook is refused. */
  twilioAuthToken?: string;
  /** The origin Twilio was given for these URLs; signatures cover the full URL. */
  publicUrl: string;
  callOut?: { kick(): void };
}

/** Where in its life a text is; a late or repeated callback never moves it backwards. */
const STATUS_RANK: Record<string, number> = {
  queued: 0,
  sending: 1,
  sent: 2,
  delivered: 3,
  undelivered: 4,
  failed: 4,
};

/**
 * Twilio's webhooks: delivery statuses for keyholder texts and keyholders' replies. They carry
 * no session, so each must carry Twilio's signature over its URL and form, or it is refused.
 */
export function createTwilioWebhookRouter(deps: TwilioWebhookDeps): Router {
  const { db } = deps;
  const router = Router();
  const form = express.urlencoded({ extended: false, limit: '32kb', parameterLimit: 100 });

  const signedByTwilio: RequestHandler = (req, _res, next) => {
    const url = `${deps.publicUrl}${req.originalUrl}`;
    const params = (req.body ?? {}) as Record<string, unknown>;
    if (
      !deps.twilioAuthToken ||
      !verifyTwilioSignature(deps.twilioAuthToken, url, params, req.get('x-twilio-signature'))
    )
      throw new ForbiddenError('This request does not carry a valid Twilio signature.');
    next();
  };

  router.post(
    '/api/webhooks/twilio/status',
    form,
    signedByTwilio,
    async function deliveryStatus(req, res) {
      const { message: messageId } = parseRequest(statusCallbackQuerySchema, req.query, 'query');
      const update = parseRequest(statusCallbackSchema, req.body, 'body');
      const status = update.MessageStatus.toLowerCase();
      let moveOn = false;
      await db.transaction(async (trx) => {
        const message = await trx('keyholder_messages')
          .where({ id: messageId })
          .forUpdate()
          .first('id', 'event_id', 'status', 'keyholder_name', 'provider_sid');
        if (!message || !(status in STATUS_RANK)) return;
        if (message.provider_sid && message.provider_sid !== update.MessageSid) return;
        if (STATUS_RANK[status]! <= STATUS_RANK[message.status]!) return;
        await trx('keyholder_messages')
          .where({ id: messageId })
          .update({
            status,
            provider_sid: update.MessageSid,
            ...(status === 'delivered' ? { delivered_at: trx.fn.now() } : {}),
            ...(status === 'sent' ? { sent_at: trx.fn.now() } : {}),
            ...(status === 'failed' || status === 'undelivered'
              ? {
                  error: `Twilio reported ${status}${update.ErrorCode ? ` (error ${update.ErrorCode})` : ''}`,
                }
              : {}),
          });
        if (status === 'delivered' || status === 'failed' || status === 'undelivered') {
          await trx('event_timeline').insert({
            event_id: message.event_id,
            kind: 'message',
            text:
              status === 'delivered'
                ? `Text to ${message.keyholder_name} delivered.`
                : `Text to ${message.keyholder_name} not delivered (${status}).`,
          });
          await notifyChange(trx, { eventId: message.event_id });
        }
        moveOn = status === 'failed' || status === 'undelivered';
      });
      if (moveOn && (await escalateIfUnanswered(db, messageId))) deps.callOut?.kick();
      res.status(204).end();
    },
  );

  router.post('/api/webhooks/twilio/inbound', form, signedByTwilio, async function reply(req, res) {
    const inbound = parseRequest(inboundMessageSchema, req.body, 'body');
    const answer = new twilio.twiml.MessagingResponse();
    const message = await messageAnsweredBy(db, inbound.From);
    const reply = readKeyholderReply(inbound.Body);
    if (!message) {
      answer.message(
        'There is no alarm call-out waiting for your reply. For anything else, phone the monitoring centre.',
      );
    } else if (!reply) {
      await db.transaction(async (trx) => {
        await trx('event_timeline').insert({
          event_id: message.event_id,
          kind: 'reply',
          text: `${message.keyholder_name} replied "${inbound.Body.trim().slice(0, 160)}" (not 1 or 2).`,
        });
        await notifyChange(trx, { eventId: message.event_id });
      });
      answer.message('Please reply 1 if you are on your way, or 2 if you cannot attend.');
    } else {
      const outcome = await db.transaction((trx) =>
        recordKeyholderReply(trx, message.id, reply, 'text'),
      );
      if (outcome.moveOn) deps.callOut?.kick();
      answer.message(
        reply === 'attending'
          ? 'Thank you: the monitoring centre knows you are on your way. Do not go in if you see signs of forced entry; wait for police at a safe distance.'
          : 'Thank you: the monitoring centre will contact the next keyholder.',
      );
    }
    res.type('text/xml').send(answer.toString());
  });

  return router;
}
