import type { ClientMetadata } from 'oidc-provider';

/** Wardbook's own web app, the IdP's one first-party client. */
export const OIDC_CLIENT_ID = 'wardbook-web';

export function wardbookWebClient(secret: string, appOrigins: string[]): ClientMetadata {
  return {
    client_id: OIDC_CLIENT_ID,
    client_secret: secret,
    client_name: 'Wardbook',
    redirect_uris: appOrigins.map((origin) => `${origin}/auth/callback`),
    post_logout_redirect_uris: appOrigins.map((origin) => `${origin}/`),
    grant_types: ['authorization_code'],
    response_types: ['code'],
    token_endpoint_auth_method: 'client_secret_basic',
  };
}
