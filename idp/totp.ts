import { Secret, TOTP } from 'otpauth';

/** RFC 6238 defaults every authenticator app understands: SHA-1, 6 digits, 30-second steps. */
const PERIOD = 30;

function totpFor(secret: string, label = 'Wardbook') {
  return new TOTP({
    issuer: 'Wardbook',
    label,
    algorithm: 'SHA1',
    digits: 6,
    period: PERIOD,
    secret: Secret.fromBase32(secret),
  });
}

export function newTotpSecret(): string {
  return new Secret({ size: 20 }).base32;
}

export function totpUri(secret: string, email: string): string {
  return totpFor(secret, email).toString();
}

/** The code for a moment; used by tests and the demo, never sent anywhere. */
export function totpCode(secret: string, at = Date.now()): string {
  return totpFor(secret).generate({ timestamp: at });
}

/**
 * Checks a code allowing one step of clock drift either way. Returns the step it matched, so
 * the caller can refuse the same step twice (a code works once), or null.
 */
export function matchTotpStep(secret: string, code: string, at = Date.now()): number | null {
  if (!/^\d{6}$/.test(code)) return null;
  const delta = totpFor(secret).validate({ token: code, timestamp: at, window: 1 });
  if (delta === null) return null;
  return Math.floor(at / 1000 / PERIOD) + delta;
}
