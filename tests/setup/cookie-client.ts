import makeFetchCookie from 'fetch-cookie';
import { CookieJar } from 'tough-cookie';
import { totpCode } from '../../idp/totp';

/**
 * A browser-less client with a cookie jar, following redirects one at a time so tests can
 * look at (and tamper with) each hop of the OpenID Connect flow.
 */
export class CookieClient {
  readonly jar = new CookieJar();
  private readonly fetchWithCookies = makeFetchCookie(fetch, this.jar);

  request(url: string, init: RequestInit = {}) {
    return this.fetchWithCookies(url, { ...init, redirect: 'manual' });
  }

  postForm(url: string, fields: Record<string, string>) {
    return this.request(url, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams(fields).toString(),
    });
  }

  /** Follows redirects from a response until `stop` says so or a non-redirect arrives. */
  async follow(response: Response, stop: (url: URL) => boolean = () => false) {
    let current = response;
    let url = new URL(current.url);
    while (current.status >= 300 && current.status < 400) {
      url = new URL(current.headers.get('location')!, url);
      if (stop(url)) return { response: current, url, stopped: true };
      current = await this.request(url.toString());
    }
    return { response: current, url, stopped: false };
  }
}

export function formAction(page: string, name: 'login' | 'totp'): string {
  const match = page.match(new RegExp(`action="(/interaction/[^"/]+/${name})"`));
  if (!match) throw new Error(`no ${name} form on the page:\n${page.slice(0, 500)}`);
  return match[1]!;
}

export interface SignInOptions {
  email: string;
  password: string;
  totpSecret?: string | null;
  /** Stop at the hop back to the app's callback instead of visiting it. */
  stopAtCallback?: boolean;
  /** Use the code of a later 30-second step (the IdP accepts one step of clock drift). */
  totpStepsAhead?: number;
}

/**
 * Walks the real sign-in: app /auth/login → IdP login page → password → one-time code (or
 * enrolment) → back to the app. Stops when the flow lands on an app page (or, if asked, at the
 * callback) without loading it, and returns that URL.
 */
export async function signInThroughIdp(
  client: CookieClient,
  apiUrl: string,
  options: SignInOptions,
) {
  const appOrigin = new URL(apiUrl).origin;
  const stop = (url: URL) =>
    url.origin === appOrigin &&
    (options.stopAtCallback
      ? url.pathname === '/auth/callback'
      : !url.pathname.startsWith('/auth/'));

  const loginPage = await client.follow(await client.request(`${apiUrl}/auth/login?returnTo=/app`));
  const loginHtml = await loginPage.response.text();
  const afterPassword = await client.follow(
    await client.postForm(new URL(formAction(loginHtml, 'login'), loginPage.url).toString(), {
      email: options.email,
      password: options.password,
    }),
    stop,
  );
  if (afterPassword.stopped)
    return { url: afterPassword.url, status: afterPassword.response.status };

  const page = await afterPassword.response.text();
  if (!page.includes('/totp"'))
    return { url: afterPassword.url, status: afterPassword.response.status, page };
  const enrolledSecret = page.match(/data-totp-secret="([A-Z2-7]+)"/)?.[1];
  const secret = enrolledSecret ?? options.totpSecret;
  if (!secret) throw new Error('a one-time code was asked for but no secret is known');
  const afterCode = await client.follow(
    await client.postForm(new URL(formAction(page, 'totp'), afterPassword.url).toString(), {
      code: totpCode(secret, Date.now() + (options.totpStepsAhead ?? 0) * 30_000),
    }),
    stop,
  );
  return {
    url: afterCode.url,
    status: afterCode.response.status,
    page: afterCode.stopped ? undefined : await afterCode.response.text(),
    enrolledSecret,
  };
}
