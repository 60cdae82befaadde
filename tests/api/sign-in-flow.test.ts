import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../seeds/data/demo-scenario';
import { CookieClient, formAction, signInThroughIdp } from '../setup/cookie-client';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation, createPerson } from '../setup/factories';
import { startStack, type RunningStack } from '../setup/stack';

const db = testDb();
let stack: RunningStack;
let installerId: string;

beforeAll(async () => {
  stack = await startStack({
    database: inject('database'),
    attemptsPerWindow: 1000,
    sendTexts: false,
  });
  installerId = (await createOrganisation(db, 'installer')).id;
});

afterAll(async () => {
  await stack.stop();
  await closeTestDb();
});

const demo = (role: string) => DEMO_ACCOUNTS.find((account) => account.role === role)!;

async function me(client: CookieClient) {
  const response = await client.request(`${stack.apiUrl}/api/me`);
  return { status: response.status, body: (await response.json()) as Record<string, unknown> };
}

async function auditActions(since: Date) {
  const rows = await db('audit_log').where('occurred_at', '>=', since).select('action', 'summary');
  return rows as { action: string; summary: string }[];
}

describe('the authorization-code flow with PKCE through our own IdP', () => {
  it('signs the demo homeowner in with a password alone and opens a session', async () => {
    const client = new CookieClient();
    const result = await signInThroughIdp(client, stack.apiUrl, {
      email: demo('homeowner').email,
      password: DEMO_PASSWORD,
    });
    expect(result.url.pathname).toBe('/app');
    const { status, body } = await me(client);
    expect(status).toBe(200);
    expect(body.user).toMatchObject({ email: demo('homeowner').email, displayName: 'Helen Marsh' });
    expect(body.roles).toEqual([{ role: 'homeowner', organisation: null }]);
  });

  it('asks the demo engineer for a one-time code, and includes roles and amr in the ID token', async () => {
    const client = new CookieClient();
    const result = await signInThroughIdp(client, stack.apiUrl, {
      email: demo('engineer').email,
      password: DEMO_PASSWORD,
      totpSecret: demo('engineer').totpSecret!,
    });
    expect(result.url.pathname).toBe('/app');
    expect(result.enrolledSecret).toBeUndefined();
    const user = await db('users')
      .where({ email: demo('engineer').email })
      .first();
    const session = await db('sessions')
      .whereRaw(`sess->>'userId' = ?`, [user.id])
      .orderBy('expire', 'desc')
      .first();
    const idToken = session.sess.idToken as string;
    const claims = JSON.parse(Buffer.from(idToken.split('.')[1]!, 'base64url').toString());
    expect(claims.roles).toEqual(['engineer']);
    expect(claims.amr).toEqual(['pwd', 'otp']);
    expect((await me(client)).body.roles).toEqual([
      {
        role: 'engineer',
        organisation: expect.objectContaining({
          name: 'Fernmoor Alarm Services Ltd',
          kind: 'installer',
        }),
      },
    ]);
  });

  it('enrols a new engineer in one-time codes on first sign-in, then asks for codes after', async () => {
    const engineer = await createPerson(db, {
      memberships: [{ role: 'engineer', organisationId: installerId }],
      totp: 'none',
    });
    const first = await signInThroughIdp(new CookieClient(), stack.apiUrl, engineer);
    expect(first.url.pathname).toBe('/app');
    expect(first.enrolledSecret).toMatch(/^[A-Z2-7]{32}$/);
    const account = await db('idp.accounts').where({ id: engineer.accountId }).first();
    expect(account.totp_secret).toBe(first.enrolledSecret);
    expect(account.totp_pending_secret).toBeNull();

    // A code step works once; the next step's code is within the allowed clock drift.
    const second = await signInThroughIdp(new CookieClient(), stack.apiUrl, {
      ...engineer,
      totpSecret: first.enrolledSecret,
      totpStepsAhead: 1,
    });
    expect(second.url.pathname).toBe('/app');
    expect(second.enrolledSecret).toBeUndefined();
  });
});

describe('bad input at sign-in', () => {
  it('refuses a wrong password and an unknown account with the same words, and audits both', async () => {
    const since = new Date();
    const person = await createPerson(db, { memberships: [{ role: 'homeowner' }] });
    for (const attempt of [
      { email: person.email, password: 'not the password' },
      { email: 'nobody-here@example.com', password: 'whatever it is' },
    ]) {
      const result = await signInThroughIdp(new CookieClient(), stack.apiUrl, attempt);
      expect(result.status).toBe(401);
      expect(result.page).toContain('That e-mail address and password do not match an account.');
      expect(result.page).not.toMatch(/at .*\.(ts|js):\d+/);
    }
    const actions = await auditActions(since);
    expect(actions.filter((a) => a.action === 'sign_in.failed').map((a) => a.summary)).toEqual(
      expect.arrayContaining([
        expect.stringContaining(`Failed sign-in for ${person.email}`),
        expect.stringContaining('unknown address nobody-here@example.com'),
      ]),
    );
  });

  it('backs off after five failures: even the right password then waits', async () => {
    const person = await createPerson(db, { memberships: [{ role: 'homeowner' }] });
    for (let attempt = 0; attempt < 5; attempt++) {
      await signInThroughIdp(new CookieClient(), stack.apiUrl, {
        email: person.email,
        password: 'wrong guess!',
      });
    }
    const locked = await signInThroughIdp(new CookieClient(), stack.apiUrl, person);
    expect(locked.status).toBe(429);
    expect(locked.page).toContain(
      'Too many failed attempts on this account. Try again in 1 minute.',
    );
    const account = await db('idp.accounts').where({ id: person.accountId }).first();
    expect(account.failed_attempts).toBe(5);
    expect(account.locked_until.getTime()).toBeGreaterThan(Date.now());
  });

  it('refuses a wrong one-time code and the same code used twice', async () => {
    const operator = await createPerson(db, {
      memberships: [
        {
          role: 'operator',
          organisationId: (await createOrganisation(db, 'monitoring_centre')).id,
        },
      ],
      totp: 'enrolled',
    });
    const wrong = await signInThroughIdp(new CookieClient(), stack.apiUrl, {
      ...operator,
      totpSecret: 'AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA',
    });
    expect(wrong.status).toBe(401);
    expect(wrong.page).toContain('That code is not right.');

    const ok = await signInThroughIdp(new CookieClient(), stack.apiUrl, {
      ...operator,
      totpSecret: operator.totpSecret!,
    });
    expect(ok.url.pathname).toBe('/app');
    const replay = await signInThroughIdp(new CookieClient(), stack.apiUrl, {
      ...operator,
      totpSecret: operator.totpSecret!,
    });
    // Unless the clock ticked into a new step between the two, the reused code is refused.
    if (Math.floor(Date.now() / 30_000) === Math.floor((Date.now() - 2000) / 30_000)) {
      expect(replay.status).toBe(401);
      expect(replay.page).toContain('That code has already been used.');
    }
  });

  it('refuses a callback whose state was tampered with, and signs nobody in', async () => {
    const since = new Date();
    const client = new CookieClient();
    const result = await signInThroughIdp(client, stack.apiUrl, {
      email: demo('keyholder').email,
      password: DEMO_PASSWORD,
      stopAtCallback: true,
    });
    const tampered = new URL(result.url);
    tampered.searchParams.set('state', 'forged-state-value');
    const response = await client.request(tampered.toString());
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/signin-error?reason=state_mismatch');
    expect((await me(client)).status).toBe(401);
    expect((await auditActions(since)).map((a) => a.action)).toContain('sign_in.rejected');
  });

  it('refuses a replayed authorization code', async () => {
    const first = new CookieClient();
    const original = await signInThroughIdp(first, stack.apiUrl, {
      email: demo('keyholder').email,
      password: DEMO_PASSWORD,
      stopAtCallback: true,
    });
    const used = await first.request(original.url.toString());
    expect(used.headers.get('location')).toBe('/app');

    // An attacker replays the code inside a sign-in of their own, with their own state.
    const attacker = new CookieClient();
    const attackerStart = await attacker.request(`${stack.apiUrl}/auth/login`);
    const attackerState = new URL(attackerStart.headers.get('location')!).searchParams.get(
      'state',
    )!;
    const replayed = new URL(original.url);
    replayed.searchParams.set('state', attackerState);
    const response = await attacker.request(replayed.toString());
    expect(response.headers.get('location')).toBe('/signin-error?reason=code_rejected');
    expect((await me(attacker)).status).toBe(401);

    // And the same callback URL again in the first browser is refused: its sign-in is over.
    const again = await first.request(original.url.toString());
    expect(again.headers.get('location')).toBe('/signin-error?reason=state_mismatch');
  });

  it('refuses an ID token whose nonce does not match the sign-in this browser started', async () => {
    const client = new CookieClient();
    const start = await client.request(`${stack.apiUrl}/auth/login`);
    const authorize = new URL(start.headers.get('location')!);
    authorize.searchParams.set('nonce', 'nonce-chosen-by-an-attacker');
    const loginPage = await client.follow(await client.request(authorize.toString()));
    const html = await loginPage.response.text();
    const afterPassword = await client.postForm(
      new URL(formAction(html, 'login'), loginPage.url).toString(),
      {
        email: demo('keyholder').email,
        password: DEMO_PASSWORD,
      },
    );
    const end = await client.follow(
      afterPassword,
      (url) => url.pathname === '/signin-error' || url.pathname === '/app',
    );
    expect(end.url.pathname + end.url.search).toBe('/signin-error?reason=state_mismatch');
    expect((await me(client)).status).toBe(401);
  });

  it('refuses a staff sign-in that did not pass the second factor', async () => {
    // The person was a homeowner at the IdP, and became an engineer before the callback.
    const person = await createPerson(db, { memberships: [{ role: 'homeowner' }] });
    const client = new CookieClient();
    const result = await signInThroughIdp(client, stack.apiUrl, {
      ...person,
      stopAtCallback: true,
    });
    await db('memberships').insert({
      user_id: person.userId,
      role: 'engineer',
      organisation_id: installerId,
    });
    const response = await client.request(result.url.toString());
    expect(response.headers.get('location')).toBe('/signin-error?reason=second_factor_missing');
  });

  it('refuses an IdP account that has no Wardbook user', async () => {
    const person = await createPerson(db, { memberships: [] });
    const client = new CookieClient();
    const result = await signInThroughIdp(client, stack.apiUrl, person);
    expect(result.url.pathname + result.url.search).toBe('/signin-error?reason=no_account');
  });

  it('shows a readable page, not a stack trace, for an expired or unknown interaction', async () => {
    const response = await new CookieClient().request(
      `${stack.idpUrl}/interaction/not-a-real-interaction`,
    );
    expect(response.status).toBe(400);
    const page = await response.text();
    expect(page).toContain('This sign-in has expired');
    expect(page).not.toMatch(/at .*\.(ts|js):\d+/);
  });
});

describe('sign-out', () => {
  it('ends the app session and the IdP session, then returns to the landing page', async () => {
    const client = new CookieClient();
    await signInThroughIdp(client, stack.apiUrl, {
      email: demo('keyholder').email,
      password: DEMO_PASSWORD,
    });
    const { body } = await me(client);
    const logout = await client.request(`${stack.apiUrl}/auth/logout`, {
      method: 'POST',
      headers: { 'x-csrf-token': String(body.csrfToken) },
    });
    expect(logout.status).toBe(200);
    const { redirectTo } = (await logout.json()) as { redirectTo: string };
    expect(redirectTo.startsWith(`${stack.idpUrl}/session/end`)).toBe(true);
    expect((await me(client)).status).toBe(401);

    // The IdP's sign-out page carries its own form; a browser submits it by script.
    const page = await (await client.request(redirectTo)).text();
    expect(page).toContain('/static/sign-out.js');
    const action = page.match(/action="([^"]+)"/)![1]!;
    const xsrf = page.match(/name="xsrf" value="([^"]+)"/)![1]!;
    const ended = await client.postForm(
      new URL(action.replace(/&amp;/g, '&'), stack.idpUrl).toString(),
      {
        xsrf,
        logout: 'yes',
      },
    );
    const back = await client.follow(ended, (url) => url.origin === stack.apiUrl);
    expect(back.url.toString()).toBe(`${stack.apiUrl}/`);

    // Signing in again needs the password again: the IdP session is gone.
    const again = await client.follow(await client.request(`${stack.apiUrl}/auth/login`));
    expect(await again.response.text()).toContain('Sign in to Wardbook');
  });
});

describe('password reset by e-mail', () => {
  it('mails a single-use link that sets a new password, and ends old IdP sessions', async () => {
    const person = await createPerson(db, { memberships: [{ role: 'homeowner' }] });
    const client = new CookieClient();
    const asked = await client.postForm(`${stack.idpUrl}/password/forgot`, { email: person.email });
    expect(await asked.text()).toContain('Check your e-mail');
    const mail = await stack.mailbox.waitFor((m) => m.to.includes(person.email));
    expect(mail.subject).toBe('Reset your Wardbook password');
    const link = mail.text.match(/http:\/\/\S+\/password\/reset\/\S+/)![0];

    const mismatch = await client.postForm(link, {
      password: 'a new long password',
      confirm: 'something else entirely',
    });
    expect(mismatch.status).toBe(400);
    expect(await mismatch.text()).toContain('The two passwords are not the same.');
    const short = await client.postForm(link, { password: 'short', confirm: 'short' });
    expect(await short.text()).toContain('Use at least 12 characters.');

    const saved = await client.postForm(link, {
      password: 'a new long password',
      confirm: 'a new long password',
    });
    expect(saved.status).toBe(200);
    expect(await saved.text()).toContain('Password saved');
    const reused = await client.request(link);
    expect(reused.status).toBe(410);

    const old = await signInThroughIdp(new CookieClient(), stack.apiUrl, person);
    expect(old.status).toBe(401);
    const fresh = await signInThroughIdp(new CookieClient(), stack.apiUrl, {
      ...person,
      password: 'a new long password',
    });
    expect(fresh.url.pathname).toBe('/app');
  });

  it('answers an unknown address exactly as a known one, and sends nothing', async () => {
    const before = stack.mailbox.list().length;
    const response = await new CookieClient().postForm(`${stack.idpUrl}/password/forgot`, {
      email: 'not-registered@example.com',
    });
    expect(response.status).toBe(200);
    expect(await response.text()).toContain('If not-registered@example.com has a Wardbook account');
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(stack.mailbox.list().length).toBe(before);
  });

  it('refuses a made-up reset token with a readable page', async () => {
    const response = await new CookieClient().request(
      `${stack.idpUrl}/password/reset/${'x'.repeat(43)}`,
    );
    expect(response.status).toBe(410);
    expect(await response.text()).toContain('This link no longer works');
  });
});
