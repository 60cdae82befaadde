import { Router, type Request, type Response } from 'express';
import { SignJWT, jwtVerify } from 'jose';
import type { Knex } from 'knex';
import type Provider from 'oidc-provider';
import QRCode from 'qrcode';
import { z } from 'zod';
import { recordAuditEntry } from '../server/audit/repository';
import {
  checkPassword,
  claimTotpStep,
  clearFailedAttempts,
  findAccountById,
  needsSecondFactor,
  recordFailedAttempt,
  secondsLocked,
  type AccountRecord,
} from './account';
import { attemptLimiter, formBody, sendPage } from './forms';
import { matchTotpStep, newTotpSecret, totpUri } from './totp';
import { enrolmentPage, loginPage, secondFactorPage } from './views/pages';

export interface InteractionDeps {
  db: Knex;
  provider: Provider;
  /** Key for the short-lived cookie that carries "password checked" to the second step. */
  pendingLoginKey: string;
  loginAttemptsPerWindow: number;
}

const PENDING_COOKIE = 'wardbook_pending_login';
const PENDING_MINUTES = 10;

const loginForm = z.object({
  email: z.string().trim().max(320).default(''),
  password: z.string().max(1024).default(''),
});
const codeForm = z.object({ code: z.string().trim().max(20).default('') });

function minutesText(seconds: number) {
  const minutes = Math.ceil(seconds / 60);
  return minutes === 1 ? '1 minute' : `${minutes} minutes`;
}

function readCookie(req: Request, name: string): string | undefined {
  const header = req.headers.cookie ?? '';
  for (const part of header.split(';')) {
    const [key, ...rest] = part.trim().split('=');
    if (key === name) return decodeURIComponent(rest.join('='));
  }
  return undefined;
}

export function createInteractionRouter(deps: InteractionDeps): Router {
  const { db, provider } = deps;
  const router = Router();
  const key = new TextEncoder().encode(deps.pendingLoginKey);
  const form = formBody;
  const attemptLimit = attemptLimiter(deps.loginAttemptsPerWindow, (req, error) =>
    loginPage({ uid: String(req.params.uid), error }),
  );

  async function audit(req: Request, action: string, summary: string, account?: AccountRecord) {
    await recordAuditEntry(db, {
      action,
      actorLabel: account?.email ?? null,
      entityType: account ? 'account' : undefined,
      entityId: account?.id,
      summary,
      ip: req.ip,
    });
  }

  async function setPendingLogin(res: Response, uid: string, accountId: string) {
    const token = await new SignJWT({ uid })
      .setProtectedHeader({ alg: 'HS256' })
      .setSubject(accountId)
      .setIssuedAt()
      .setExpirationTime(`${PENDING_MINUTES}m`)
      .sign(key);
    res.cookie(PENDING_COOKIE, token, {
      httpOnly: true,
      sameSite: 'lax',
      path: `/interaction/${uid}`,
      maxAge: PENDING_MINUTES * 60 * 1000,
    });
  }

  /** The account whose password was checked in this interaction, if any. */
  async function pendingAccount(req: Request, uid: string) {
    const token = readCookie(req, PENDING_COOKIE);
    if (!token) return undefined;
    try {
      const { payload } = await jwtVerify(token, key, { algorithms: ['HS256'] });
      if (payload.uid !== uid || !payload.sub) return undefined;
      return await findAccountById(db, payload.sub);
    } catch {
      return undefined;
    }
  }

  async function finishLogin(req: Request, res: Response, account: AccountRecord, amr: string[]) {
    await clearFailedAttempts(db, account.id);
    res.clearCookie(PENDING_COOKIE, { path: `/interaction/${req.params.uid}` });
    await audit(
      req,
      'idp.sign_in',
      `${account.email} passed ${amr.join(' + ')} at the IdP`,
      account,
    );
    await provider.interactionFinished(
      req,
      res,
      { login: { accountId: account.id, amr, acr: amr.includes('otp') ? 'mfa' : 'pwd' } },
      { mergeWithLastSubmission: false },
    );
  }

  async function renderSecondFactor(
    res: Response,
    uid: string,
    account: AccountRecord,
    error?: string,
  ) {
    if (account.totp_secret) {
      sendPage(res, res.statusCode, secondFactorPage({ uid, error }));
      return;
    }
    // First sign-in of a staff account: enrol an authenticator before going further.
    let secret = account.totp_pending_secret;
    if (!secret) {
      secret = newTotpSecret();
      await db('idp.accounts').where({ id: account.id }).update({ totp_pending_secret: secret });
    }
    const qrDataUrl = await QRCode.toDataURL(totpUri(secret, account.email), {
      margin: 1,
      width: 200,
    });
    sendPage(res, res.statusCode, enrolmentPage({ uid, secret, qrDataUrl, error }));
  }

  // --- Show the step this interaction is at ----------------------------------------------------
  router.get('/interaction/:uid', async function showInteraction(req, res) {
    const details = await provider.interactionDetails(req, res);
    const uid = details.uid;
    if (details.prompt.name === 'login') {
      const account = await pendingAccount(req, uid);
      if (account) return renderSecondFactor(res, uid, account);
      sendPage(res, 200, loginPage({ uid }));
      return;
    }
    // Wardbook's own web app is the only client and needs no consent screen; a grant is
    // issued in configuration.loadExistingGrant, so any other prompt is finished as is.
    await provider.interactionFinished(req, res, {}, { mergeWithLastSubmission: true });
  });

  // --- Password ---------------------------------------------------------------------------------
  router.post(
    '/interaction/:uid/login',
    attemptLimit,
    form,
    async function submitPassword(req, res) {
      const details = await provider.interactionDetails(req, res);
      const { email, password } = loginForm.parse(req.body ?? {});
      if (!email || !password) {
        sendPage(
          res,
          400,
          loginPage({
            uid: details.uid,
            email,
            error: 'Enter your e-mail address and password.',
          }),
        );
        return;
      }
      const check = await checkPassword(db, email, password);
      if (!check.ok) {
        const reason =
          check.reason === 'locked'
            ? `Too many failed attempts on this account. Try again in ${minutesText(check.retryAfterSeconds)}.`
            : 'That e-mail address and password do not match an account.';
        await audit(
          req,
          'sign_in.failed',
          check.account
            ? `Failed sign-in for ${check.account.email} (${check.reason === 'locked' ? 'account backing off' : 'wrong password'})`
            : `Failed sign-in for unknown address ${email.slice(0, 120)}`,
          check.account,
        );
        sendPage(
          res,
          check.reason === 'locked' ? 429 : 401,
          loginPage({ uid: details.uid, email, error: reason }),
        );
        return;
      }
      if (await needsSecondFactor(db, check.account)) {
        await setPendingLogin(res, details.uid, check.account.id);
        res.redirect(303, `/interaction/${details.uid}`);
        return;
      }
      await finishLogin(req, res, check.account, ['pwd']);
    },
  );

  // --- One-time code (enrolment or sign-in) ----------------------------------------------------
  router.post('/interaction/:uid/totp', attemptLimit, form, async function submitCode(req, res) {
    const details = await provider.interactionDetails(req, res);
    const account = await pendingAccount(req, details.uid);
    if (!account) {
      sendPage(
        res,
        400,
        loginPage({
          uid: details.uid,
          error: 'Your sign-in took too long. Enter your password again.',
        }),
      );
      return;
    }
    const wait = secondsLocked(account);
    if (wait > 0) {
      res.status(429);
      return renderSecondFactor(
        res,
        details.uid,
        account,
        `Too many failed attempts. Try again in ${minutesText(wait)}.`,
      );
    }
    const { code } = codeForm.parse(req.body ?? {});
    const secret = account.totp_secret ?? account.totp_pending_secret;
    const step = secret ? matchTotpStep(secret, code.replace(/\s/g, '')) : null;
    if (step === null || !(await claimTotpStep(db, account.id, step))) {
      await recordFailedAttempt(db, account.id);
      await audit(req, 'sign_in.failed', `Failed one-time code for ${account.email}`, account);
      res.status(401);
      return renderSecondFactor(
        res,
        details.uid,
        account,
        step === null
          ? 'That code is not right. Check the clock on your phone and use the newest code.'
          : 'That code has already been used. Wait for the next one.',
      );
    }
    if (!account.totp_secret) {
      await db('idp.accounts')
        .where({ id: account.id })
        .update({ totp_secret: secret, totp_pending_secret: null, updated_at: db.fn.now() });
      await audit(req, 'idp.totp_enrolled', `${account.email} set up one-time codes`, account);
    }
    await finishLogin(req, res, account, ['pwd', 'otp']);
  });

  router.get('/interaction/:uid/abort', async function abort(req, res) {
    await provider.interactionFinished(
      req,
      res,
      { error: 'access_denied', error_description: 'The person cancelled sign-in.' },
      { mergeWithLastSubmission: false },
    );
  });

  return router;
}
