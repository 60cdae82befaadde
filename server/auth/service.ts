import * as openid from 'openid-client';
import type { Knex } from 'knex';
import { z } from 'zod';
import { recordAuditEntry } from '../audit/repository';
import {
  findUserBySubject,
  refreshUserProfile,
  type UserWithMemberships,
} from '../users/repository';
import { STAFF_ROLES } from '../users/roles';
import type { OidcClient } from './oidc-client';
import type { PendingSignIn } from './session';

export const SCOPES = 'openid email profile roles';

/** Reasons a sign-in can fail, shown to the person in plain words by the client. */
export type SignInFailure =
  | 'state_mismatch'
  | 'code_rejected'
  | 'provider_error'
  | 'no_account'
  | 'second_factor_missing'
  | 'access_denied';

export class SignInError extends Error {
  constructor(
    readonly reason: SignInFailure,
    detail: string,
  ) {
    super(detail);
  }
}

/** Only same-site paths may be returned to, never another origin. */
export function safeReturnPath(value: unknown): string {
  if (typeof value !== 'string' || !value.startsWith('/') || value.startsWith('//')) return '/app';
  if (value.startsWith('/auth/') || value.includes('\\')) return '/app';
  return value;
}

export async function beginSignIn(
  oidc: OidcClient,
  redirectUri: string,
  returnTo: string,
): Promise<{ authorizationUrl: URL; pending: PendingSignIn }> {
  const configuration = await oidc.configuration();
  const codeVerifier = openid.randomPKCECodeVerifier();
  const pending: PendingSignIn = {
    state: openid.randomState(),
    nonce: openid.randomNonce(),
    codeVerifier,
    redirectUri,
    returnTo,
    startedAt: Date.now(),
  };
  const authorizationUrl = openid.buildAuthorizationUrl(configuration, {
    redirect_uri: redirectUri,
    scope: SCOPES,
    response_type: 'code',
    code_challenge: await openid.calculatePKCECodeChallenge(codeVerifier),
    code_challenge_method: 'S256',
    state: pending.state,
    nonce: pending.nonce,
  });
  return { authorizationUrl, pending };
}

const claimsSchema = z.object({
  sub: z.string().min(1),
  email: z.string().email(),
  name: z.string().min(1),
  amr: z.array(z.string()).optional(),
});

const TEN_MINUTES = 10 * 60 * 1000;

export interface CompletedSignIn {
  user: UserWithMemberships;
  idToken: string;
}

/**
 * Exchanges the authorization code (PKCE, state and nonce checked by openid-client) and maps
 * the IdP subject onto a Wardbook user. Staff roles must have passed the second factor.
 */
export async function completeSignIn(
  db: Knex,
  oidc: OidcClient,
  pending: PendingSignIn | undefined,
  callbackUrl: URL,
): Promise<CompletedSignIn> {
  const providerError = callbackUrl.searchParams.get('error');
  if (providerError) {
    throw new SignInError(
      providerError === 'access_denied' ? 'access_denied' : 'provider_error',
      `identity provider answered ${providerError}`,
    );
  }
  if (!pending || Date.now() - pending.startedAt > TEN_MINUTES) {
    throw new SignInError('state_mismatch', 'no sign-in was in progress in this browser');
  }
  if (callbackUrl.searchParams.get('state') !== pending.state) {
    throw new SignInError('state_mismatch', 'state does not match the sign-in in progress');
  }

  const configuration = await oidc.configuration();
  let tokens: Awaited<ReturnType<typeof openid.authorizationCodeGrant>>;
  try {
    tokens = await openid.authorizationCodeGrant(configuration, callbackUrl, {
      pkceCodeVerifier: pending.codeVerifier,
      expectedState: pending.state,
      expectedNonce: pending.nonce,
      idTokenExpected: true,
    });
  } catch (error) {
    const { error: oauthError, code } = error as { code?: string; error?: string };
    if (oauthError === 'invalid_grant') {
      throw new SignInError('code_rejected', 'the authorization code was refused');
    }
    if (code === 'OAUTH_JWT_CLAIM_COMPARISON_FAILED') {
      // The ID token answers a different request than the one this browser started (nonce).
      throw new SignInError('state_mismatch', (error as Error).message);
    }
    throw new SignInError('provider_error', (error as Error).message);
  }

  const claims = claimsSchema.safeParse(tokens.claims());
  if (!claims.success || !tokens.id_token) {
    throw new SignInError('provider_error', 'the ID token lacked the expected claims');
  }
  const user = await findUserBySubject(db, claims.data.sub);
  if (!user || user.disabled || user.memberships.length === 0) {
    throw new SignInError('no_account', `no active Wardbook user for subject ${claims.data.sub}`);
  }
  const needsSecondFactor = user.memberships.some((m) => STAFF_ROLES.includes(m.role));
  if (needsSecondFactor && !claims.data.amr?.includes('otp')) {
    throw new SignInError('second_factor_missing', 'staff sign-in without a one-time password');
  }
  await refreshUserProfile(db, user.id, {
    email: claims.data.email,
    displayName: claims.data.name,
  });
  return { user, idToken: tokens.id_token };
}

export async function endSessionUrl(
  oidc: OidcClient,
  idToken: string | undefined,
  postLogoutRedirectUri: string,
): Promise<string> {
  const configuration = await oidc.configuration();
  return openid
    .buildEndSessionUrl(configuration, {
      post_logout_redirect_uri: postLogoutRedirectUri,
      ...(idToken ? { id_token_hint: idToken } : {}),
    })
    .toString();
}

export async function auditSignIn(
  db: Knex,
  entry: {
    user?: UserWithMemberships;
    succeeded: boolean;
    reason?: string;
    ip?: string;
    requestId?: string;
  },
) {
  await recordAuditEntry(db, {
    actorUserId: entry.user?.id ?? null,
    actorLabel: entry.user?.displayName ?? null,
    action: entry.succeeded ? 'sign_in.succeeded' : 'sign_in.rejected',
    entityType: entry.user ? 'user' : undefined,
    entityId: entry.user?.id,
    summary: entry.succeeded
      ? `${entry.user?.displayName} signed in`
      : `Sign-in refused at the app: ${entry.reason}`,
    ip: entry.ip,
    requestId: entry.requestId,
  });
}
