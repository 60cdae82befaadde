import { timingSafeEqual } from 'node:crypto';
import type { Knex } from 'knex';
import { AppError, ValidationError } from '../../http/errors';
import {
  monitoredSitesWithAccount,
  siteWithIntakeTokenHash,
  type CredentialsRow,
} from '../credentials/repository';
import { hashIntakeToken } from '../credentials/service';
import { recordSignal } from '../repository';
import { readSignalContent } from '../signal-content';
import type { IntakeReceipt, IntakeSignal } from './schema';

/** 401 for a device: it has no session to sign in with, only its token. */
export class IntakeUnauthorisedError extends AppError {
  constructor(detail: string) {
    super(401, 'intake-token', 'Not authorised', detail);
  }
}

export class IntakeForbiddenError extends AppError {
  constructor(detail: string) {
    super(403, 'intake-account', 'Not allowed', detail);
  }
}

const BEARER = /^Bearer ([A-Za-z0-9._~+/=-]{1,200})$/;

/**
 * The site whose intake token the request presents. Looked up by the token's SHA-256, which
 * is all the database holds; an unknown or missing token is a 401.
 */
export async function siteForIntakeToken(
  db: Knex,
  authorization: string | undefined,
): Promise<{ site: CredentialsRow; tokenHash: string }> {
  const token = BEARER.exec(authorization ?? '')?.[1];
  if (!token)
    throw new IntakeUnauthorisedError(
      'Send the site’s intake token: Authorization: Bearer <token>.',
    );
  const tokenHash = hashIntakeToken(token);
  const site = await siteWithIntakeTokenHash(db, tokenHash);
  if (!site) throw new IntakeUnauthorisedError('This intake token is not known, or was replaced.');
  return { site, tokenHash };
}

/** Whether the token hash is the one stored for the account, compared in constant time. */
async function tokenHoldsAccount(db: Knex, account: string, tokenHash: string) {
  const presented = Buffer.from(tokenHash, 'hex');
  let holds = false;
  for (const site of await monitoredSitesWithAccount(db, account)) {
    if (!site.intake_token_hash) continue;
    // Every candidate is compared, so the time taken does not tell which one matched.
    if (timingSafeEqual(Buffer.from(site.intake_token_hash, 'hex'), presented)) holds = true;
  }
  return holds;
}

/**
 * Records one signal posted over HTTPS, with the same duplicate rules as DC-09: a resend (same
 * account, sequence and data within ten minutes) is stored once. Resolves only after commit.
 */
export async function receiveIntakeSignal(
  db: Knex,
  tokenHash: string,
  input: IntakeSignal,
  raw: string,
): Promise<IntakeReceipt> {
  if (!(await tokenHoldsAccount(db, input.account, tokenHash)))
    throw new IntakeForbiddenError(
      `This intake token belongs to another account, not ${input.account}.`,
    );
  const content = readSignalContent(input.format, input.data);
  if (!content)
    throw new ValidationError([
      {
        path: 'body.data',
        message:
          input.format === 'ADM-CID'
            ? 'This is not Contact ID data: qualifier, event code, group and zone, e.g. 1130 01 003.'
            : 'This is not a SIA-DCS event: N, optionally ri and an area, the two-letter code and zone, e.g. Nri1/BA03.',
      },
    ]);
  if (content.account !== null && content.account !== input.account)
    throw new ValidationError([
      {
        path: 'body.data',
        message: `The data names account ${content.account}, but the signal is for ${input.account}.`,
      },
    ]);
  const stored = await recordSignal(db, {
    transport: 'https',
    protocol: input.format,
    account: input.account,
    sequence: input.sequence,
    receiver: null,
    linePrefix: null,
    data: input.data,
    wasEncrypted: false,
    panelTime: input.timestamp ? new Date(input.timestamp) : null,
    raw,
    eventCode: content.eventCode,
    category: content.category,
    qualifier: content.qualifier,
    zoneOrUser: content.zoneOrUser,
    partition: content.partition,
  });
  return { signalId: stored.id, duplicate: stored.duplicate };
}
