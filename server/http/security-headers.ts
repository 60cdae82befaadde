import helmet from 'helmet';

/**
 * Helmet with a strict Content-Security-Policy, shared by the API and the IdP: scripts, styles
 * and fonts from our own origin only, nothing inline, no framing.
 */
export function securityHeaders(options: {
  /** https deployments get HSTS and upgrade-insecure-requests; plain loopback must not. */
  secure: boolean;
  /** Form targets beyond 'self' (browsers apply form-action to the redirects after a post). */
  formTargets?: string[];
  imgSources?: string[];
  referrerPolicy?: 'same-origin' | 'no-referrer';
}) {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'"],
        imgSrc: ["'self'", ...(options.imgSources ?? [])],
        fontSrc: ["'self'"],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'", ...(options.formTargets ?? [])],
        frameAncestors: ["'none'"],
        ...(options.secure ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: options.secure,
    referrerPolicy: { policy: options.referrerPolicy ?? 'same-origin' },
  });
}
