import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { recordAuditEntry, type AuditEntryInput } from '../../audit/repository';
import { NotFoundError } from '../../http/errors';
import {
  findCentreSite,
  storeIntakeTokenHash,
  updateDc09Key,
  type CredentialsRow,
} from './repository';
import {
  ENCRYPTION_NAMES,
  type IssuedIntakeToken,
  type SignallingCredentials,
  type SignallingCredentialsInput,
} from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Intake tokens start with this, so one pasted into the wrong place is recognisable. */
export const INTAKE_TOKEN_PREFIX = 'wbi_';

export const hashIntakeToken = (token: string) =>
  createHash('sha256').update(token, 'utf8').digest('hex');

function encryptionOf(key: string | null): SignallingCredentials['encryption'] {
  return key ? ENCRYPTION_NAMES[key.length as keyof typeof ENCRYPTION_NAMES] : null;
}

function toCredentials(row: CredentialsRow): SignallingCredentials {
  return {
    siteId: row.id,
    account: row.monitoring_account,
    encryption: encryptionOf(row.dc09_key),
    intakeTokenIssuedAt: row.intake_token_issued_at?.toISOString() ?? null,
  };
}

/** The site, if one of the operator's centres monitors it; a 404 for anything else. */
export async function requireCentreSite(db: Knex, centreIds: string[], siteId: string) {
  if (!UUID.test(siteId)) throw new NotFoundError();
  const site = await findCentreSite(db, centreIds, siteId);
  if (!site) throw new NotFoundError();
  return site;
}

/**
 * Sets or clears the account's DC-09 key. From then on the receiver takes only encrypted frames
 * from this account (or only plain ones, once cleared). The audit entry names the strength, never
 * the key.
 */
export async function setSignallingCredentials(
  db: Knex,
  site: CredentialsRow,
  input: SignallingCredentialsInput,
  actor: Actor,
): Promise<SignallingCredentials> {
  return db.transaction(async (trx) => {
    const row = await updateDc09Key(trx, site.id, input.dc09Key);
    const before = encryptionOf(site.dc09_key);
    const after = encryptionOf(row.dc09_key);
    await recordAuditEntry(trx, {
      ...actor,
      action: input.dc09Key ? 'site.dc09_key_set' : 'site.dc09_key_cleared',
      entityType: 'site',
      entityId: site.id,
      organisationId: site.monitoring_centre_id,
      summary: input.dc09Key
        ? `DC-09 encryption key set for account ${site.monitoring_account} (${after})`
        : `DC-09 encryption key cleared for account ${site.monitoring_account}`,
      changes: { encryption: { before, after } },
    });
    return toCredentials(row);
  });
}

/**
 * Issues a new intake token for the site, replacing any before it (which stops working at once).
 * The token is returned this once; only its SHA-256 is stored, so a leaked database does not
 * let anyone post signals.
 */
export async function issueIntakeToken(
  db: Knex,
  site: CredentialsRow,
  actor: Actor,
): Promise<IssuedIntakeToken> {
  const token = `${INTAKE_TOKEN_PREFIX}${randomBytes(32).toString('base64url')}`;
  return db.transaction(async (trx) => {
    const row = await storeIntakeTokenHash(trx, site.id, hashIntakeToken(token));
    await recordAuditEntry(trx, {
      ...actor,
      action: 'site.intake_token_issued',
      entityType: 'site',
      entityId: site.id,
      organisationId: site.monitoring_centre_id,
      summary: site.intake_token_hash
        ? `HTTPS intake token reissued for account ${site.monitoring_account}; the old one no longer works`
        : `HTTPS intake token issued for account ${site.monitoring_account}`,
    });
    return {
      siteId: row.id,
      account: row.monitoring_account,
      token,
      issuedAt: row.intake_token_issued_at!.toISOString(),
    };
  });
}
