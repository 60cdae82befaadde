import type { Knex } from 'knex';
import { findOrCreateInvitedAccount } from '../../idp/account';
import { issuePasswordToken } from '../../idp/password-tokens';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { AppError } from '../http/errors';
import type { Mailer } from '../mail/mailer';

export interface InvitationDeps {
  db: Knex;
  mailer: Mailer;
  /** Where the set-password page lives (the identity provider). */
  idpIssuer: string;
  /** Where people sign in afterwards. */
  appUrl: string;
}

const INVITATION_DAYS = 7;

export interface Invitation {
  email: string;
  displayName: string;
  role: 'homeowner' | 'keyholder';
  siteName: string;
  invitedBy: string;
  organisationId: string;
  actor: Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;
  /** Ties the person to the record they are invited to (a site, a keyholder row). */
  link(trx: Knex.Transaction, userId: string): Promise<void>;
}

/**
 * Creates (or finds) the person's account and Wardbook user, gives them the role, links them
 * to the record, and e-mails them: a link to choose a password if they have none yet, or a
 * note that the site is now in their Wardbook.
 */
export async function invitePerson(
  deps: InvitationDeps,
  invitation: Invitation,
): Promise<{ userId: string }> {
  const { db } = deps;
  const { userId, token } = await db.transaction(async (trx) => {
    const { account } = await findOrCreateInvitedAccount(
      trx,
      invitation.email,
      invitation.displayName,
    );
    let user = await trx('users')
      .where({ idp_subject: account.id })
      .first<{ id: string } | undefined>('id');
    if (!user) {
      [user] = await trx('users')
        .insert({
          idp_subject: account.id,
          email: account.email,
          display_name: account.display_name,
        })
        .returning('id');
    }
    await trx('memberships')
      .insert({ user_id: user!.id, role: invitation.role, organisation_id: null })
      .onConflict()
      .ignore();
    await invitation.link(trx, user!.id);
    const token = account.password_hash
      ? null
      : await issuePasswordToken(trx, account.id, 'invitation', INVITATION_DAYS * 24 * 60);
    await recordAuditEntry(trx, {
      ...invitation.actor,
      action: `${invitation.role}.invited`,
      entityType: 'user',
      entityId: user!.id,
      organisationId: invitation.organisationId,
      summary: `Invited ${invitation.displayName} <${account.email}> as ${invitation.role} for ${invitation.siteName}`,
    });
    return { userId: user!.id, token };
  });

  const roleWords = invitation.role === 'homeowner' ? 'see and manage' : 'hold keys for';
  const text = token
    ? [
        `Hello ${invitation.displayName},`,
        '',
        `${invitation.invitedBy} has invited you to Wardbook, where you can ${roleWords} ${invitation.siteName}.`,
        `Choose your password within ${INVITATION_DAYS} days at:`,
        '',
        `${deps.idpIssuer}/password/reset/${token}`,
        '',
        `Then sign in at ${deps.appUrl}/`,
      ]
    : [
        `Hello ${invitation.displayName},`,
        '',
        `${invitation.invitedBy} has added ${invitation.siteName} to your Wardbook, where you can ${roleWords} it.`,
        `Sign in as usual at ${deps.appUrl}/`,
      ];
  try {
    await deps.mailer.send({
      to: invitation.email,
      subject: token
        ? 'You are invited to Wardbook'
        : `${invitation.siteName} is now in your Wardbook`,
      text: text.join('\n'),
    });
  } catch {
    throw new AppError(
      502,
      'mail-failed',
      'Invitation saved, e-mail not sent',
      'The invitation is saved, but the e-mail could not be sent. Send the invitation again shortly.',
    );
  }
  return { userId };
}
