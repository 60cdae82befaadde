import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { recordAuditEntry } from '../server/audit/repository';
import type { Mailer } from '../server/mail/mailer';
import { attemptLimiter, formBody, sendPage } from './forms';
import { clearFailedAttempts, findAccountByEmail, hashPassword } from './account';
import { issuePasswordToken, usableToken } from './password-tokens';
import { forgotPasswordPage, messagePage, resetPasswordPage } from './views/pages';

export interface PasswordRouterDeps {
  db: Knex;
  mailer: Mailer;
  issuer: string;
  appUrl: string;
  requestsPerWindow: number;
}

const RESET_MINUTES = 30;

const forgotForm = z.object({ email: z.string().trim().max(320).default('') });
const resetForm = z.object({
  password: z.string().max(1024).default(''),
  confirm: z.string().max(1024).default(''),
});

export function passwordProblem(
  password: string,
  confirm: string,
  email: string,
): string | undefined {
  if (password.length < 12) return 'Use at least 12 characters.';
  if (password !== confirm) return 'The two passwords are not the same.';
  // Short local parts ("jo@…") would flag almost any password, so only longer ones count.
  const localPart = email.split('@')[0]!.toLowerCase();
  if (localPart.length >= 4 && password.toLowerCase().includes(localPart)) {
    return 'Do not build the password from your e-mail address.';
  }
  return undefined;
}

export function createPasswordRouter(deps: PasswordRouterDeps): Router {
  const { db } = deps;
  const router = Router();
  const form = formBody;
  const limit = attemptLimiter(deps.requestsPerWindow, (_req, error) =>
    forgotPasswordPage({ error }),
  );
  const expired = messagePage({
    title: 'This link no longer works',
    message:
      'Password links work once, and only for a while: 30 minutes after a reset request, 7 days after an invitation. Ask for a new one and use the newest e-mail.',
    link: { href: '/password/forgot', text: 'Send a new link' },
  });

  router.get('/password/forgot', (_req, res) => {
    sendPage(res, 200, forgotPasswordPage());
  });

  router.post('/password/forgot', limit, form, async function requestReset(req, res) {
    const { email } = forgotForm.parse(req.body ?? {});
    if (!z.email().safeParse(email).success) {
      sendPage(res, 400, forgotPasswordPage({ email, error: 'Enter a valid e-mail address.' }));
      return;
    }
    const account = await findAccountByEmail(db, email);
    if (account) {
      const token = await issuePasswordToken(db, account.id, 'reset', RESET_MINUTES);
      const link = `${deps.issuer}/password/reset/${token}`;
      await deps.mailer.send({
        to: account.email,
        subject: 'Reset your Wardbook password',
        text: [
          `Hello ${account.display_name},`,
          '',
          `Someone asked to reset the password for this Wardbook account. To choose a new one, open this link within ${RESET_MINUTES} minutes:`,
          '',
          link,
          '',
          'If it was not you, ignore this e-mail; your password stays as it is.',
        ].join('\n'),
      });
      await recordAuditEntry(db, {
        action: 'password_reset.requested',
        actorLabel: account.email,
        entityType: 'account',
        entityId: account.id,
        summary: `Password reset link sent to ${account.email}`,
        ip: req.ip,
      });
    }
    // The same answer whether or not the address is known, so accounts cannot be discovered.
    sendPage(
      res,
      200,
      messagePage({
        title: 'Check your e-mail',
        message: `If ${email} has a Wardbook account, a link to reset its password is on its way. It works for ${RESET_MINUTES} minutes.`,
      }),
    );
  });

  router.get('/password/reset/:token', async function showReset(req, res) {
    const token = String(req.params.token);
    const row = await usableToken(db, token);
    if (!row) {
      sendPage(res, 410, expired);
      return;
    }
    sendPage(res, 200, resetPasswordPage({ token, purpose: row.purpose }));
  });

  router.post('/password/reset/:token', limit, form, async function saveReset(req, res) {
    const token = String(req.params.token);
    const row = await usableToken(db, token);
    if (!row) {
      sendPage(res, 410, expired);
      return;
    }
    const { password, confirm } = resetForm.parse(req.body ?? {});
    const account = await db('idp.accounts')
      .where({ id: row.account_id })
      .first<{ email: string }>('email');
    const problem = passwordProblem(password, confirm, account?.email ?? '');
    if (problem) {
      sendPage(res, 400, resetPasswordPage({ token, purpose: row.purpose, error: problem }));
      return;
    }
    const passwordHash = await hashPassword(password);
    await db.transaction(async (trx) => {
      const claimed = await trx('idp.password_tokens')
        .where({ id: row.id })
        .whereNull('used_at')
        .update({ used_at: trx.fn.now() });
      if (claimed !== 1) return;
      await trx('idp.accounts').where({ id: row.account_id }).update({
        password_hash: passwordHash,
        password_changed_at: trx.fn.now(),
        updated_at: trx.fn.now(),
      });
      // Anyone signed in with the old password is signed out everywhere.
      await trx('idp.oidc_payloads')
        .where({ model: 'Session' })
        .whereRaw(`payload->>'accountId' = ?`, [row.account_id])
        .delete();
      await recordAuditEntry(trx, {
        action: 'password.changed',
        actorLabel: account?.email ?? null,
        entityType: 'account',
        entityId: row.account_id,
        summary: `Password ${row.purpose === 'invitation' ? 'set after invitation' : 'reset'} for ${account?.email}`,
        ip: req.ip,
      });
    });
    await clearFailedAttempts(db, row.account_id);
    sendPage(
      res,
      200,
      messagePage({
        title: 'Password saved',
        message: 'Your new password is ready. Sign in to Wardbook with it.',
        link: { href: `${deps.appUrl}/auth/login`, text: 'Sign in to Wardbook' },
      }),
    );
  });

  return router;
}
