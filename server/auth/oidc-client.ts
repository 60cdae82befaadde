import * as openid from 'openid-client';

export interface OidcClientOptions {
  issuer: string;
  clientId: string;
  clientSecret: string;
}

export interface OidcClient {
  /** Discovery runs once, lazily, and is retried after a failure (the IdP may start later). */
  configuration(): Promise<openid.Configuration>;
}

function isLoopback(url: URL) {
  return ['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname);
}

export function createOidcClient(options: OidcClientOptions): OidcClient {
  const issuer = new URL(options.issuer);
  let discovered: Promise<openid.Configuration> | undefined;
  return {
    configuration() {
      discovered ??= openid
        .discovery(
          issuer,
          options.clientId,
          undefined,
          openid.ClientSecretBasic(options.clientSecret),
          // Plain HTTP is allowed only to an IdP on this machine (development and tests).
          isLoopback(issuer) && issuer.protocol === 'http:'
            ? { execute: [openid.allowInsecureRequests], timeout: 5 }
            : { timeout: 5 },
        )
        .catch((error: unknown) => {
          discovered = undefined;
          throw error;
        });
      return discovered;
    },
  };
}
