import type { Knex } from 'knex';
import type { Configuration, KoaContextWithOIDC } from 'oidc-provider';
import { accountFinder } from './account';
import { createPostgresAdapter } from './adapter';
import { OIDC_CLIENT_ID, wardbookWebClient } from './clients';
import type { Jwks } from './keys';
import { errorPage, logoutPage, messagePage } from './views/pages';

export interface ConfigurationDeps {
  db: Knex;
  jwks: Jwks;
  cookieKeys: string[];
  clientSecret: string;
  appOrigins: string[];
}

const SCOPES = ['openid', 'email', 'profile', 'roles'];
const EIGHT_HOURS = 8 * 60 * 60;

function render(ctx: KoaContextWithOIDC, body: string) {
  ctx.type = 'html';
  ctx.body = body;
}

export function buildConfiguration(deps: ConfigurationDeps): Configuration {
  const appUrl = deps.appOrigins[0]!;
  return {
    adapter: createPostgresAdapter(deps.db),
    clients: [wardbookWebClient(deps.clientSecret, deps.appOrigins)],
    findAccount: accountFinder(deps.db),
    jwks: deps.jwks as Configuration['jwks'],
    cookies: { keys: deps.cookieKeys },
    scopes: SCOPES,
    claims: {
      // amr ("pwd", or "pwd" + "otp") rides with openid: the app checks that staff used a
      // second factor.
      openid: ['sub', 'amr'],
      email: ['email', 'email_verified'],
      profile: ['name'],
      roles: ['roles'], // engineer, office, homeowner, keyholder, operator
      acr: null,
      auth_time: null,
      sid: null,
      iss: null,
    },
    // Wardbook reads roles and name from the ID token; it does not call userinfo.
    conformIdTokenClaims: false,
    responseTypes: ['code'],
    pkce: { required: () => true }, // S256 only, the library default
    features: {
      devInteractions: { enabled: false }, // our own login pages in idp/views
      revocation: { enabled: true },
      rpInitiatedLogout: {
        enabled: true,
        async logoutSource(ctx, form) {
          render(ctx, logoutPage({ form, automatic: Boolean(ctx.oidc.params?.id_token_hint) }));
        },
        async postLogoutSuccessSource(ctx) {
          render(
            ctx,
            messagePage({
              title: 'Signed out',
              message: 'You are signed out of Wardbook on this device.',
              link: { href: `${appUrl}/`, text: 'Back to Wardbook' },
            }),
          );
        },
      },
    },
    interactions: { url: (_ctx, interaction) => `/interaction/${interaction.uid}` },
    // Wardbook's web app is first-party: grant it its scopes without a consent screen.
    async loadExistingGrant(ctx) {
      const client = ctx.oidc.client!;
      const session = ctx.oidc.session!;
      const grantId = ctx.oidc.result?.consent?.grantId ?? session.grantIdFor(client.clientId);
      if (grantId) {
        const existing = await ctx.oidc.provider.Grant.find(grantId);
        if (existing) return existing;
      }
      if (client.clientId !== OIDC_CLIENT_ID || !session.accountId) return undefined;
      const grant = new ctx.oidc.provider.Grant({
        clientId: client.clientId,
        accountId: session.accountId,
      });
      grant.addOIDCScope(SCOPES.join(' '));
      await grant.save();
      return grant;
    },
    ttl: {
      AuthorizationCode: 60,
      AccessToken: 600,
      IdToken: 3600,
      Interaction: 30 * 60,
      Session: EIGHT_HOURS,
      Grant: EIGHT_HOURS,
    },
    async renderError(ctx, out) {
      render(
        ctx,
        errorPage({
          title: 'Sign-in could not continue',
          message:
            out.error_description ??
            'The sign-in request was not valid. Start again from Wardbook.',
          appUrl,
        }),
      );
    },
  };
}
