import { describe, expect, it } from 'vitest';
import { matchTotpStep, newTotpSecret, totpCode, totpUri } from '../../idp/totp';

// RFC 6238 Appendix B test vectors, SHA-1, secret "12345678901234567890" (ASCII), whose base32
// form is below. The RFC prints 8-digit codes; a 6-digit code is the same value mod 10^6.
const RFC_SECRET = 'GEZDGNBVGY3TQOJQGEZDGNBVGY3TQOJQ';
const RFC_VECTORS: [seconds: number, eightDigits: string][] = [
  [59, '94287082'],
  [1111111109, '07081804'],
  [1111111111, '14050471'],
  [1234567890, '89005924'],
  [2000000000, '69279037'],
  [20000000000, '65353130'],
];

describe('TOTP (RFC 6238)', () => {
  it.each(RFC_VECTORS)('gives the RFC 6238 Appendix B code at T=%i', (seconds, eightDigits) => {
    expect(totpCode(RFC_SECRET, seconds * 1000)).toBe(eightDigits.slice(-6));
  });

  it('accepts a code one step either side, and names the step it matched', () => {
    const now = 1_234_567_890_000;
    const step = Math.floor(now / 30_000);
    expect(matchTotpStep(RFC_SECRET, totpCode(RFC_SECRET, now), now)).toBe(step);
    expect(matchTotpStep(RFC_SECRET, totpCode(RFC_SECRET, now - 30_000), now)).toBe(step - 1);
    expect(matchTotpStep(RFC_SECRET, totpCode(RFC_SECRET, now + 30_000), now)).toBe(step + 1);
    expect(matchTotpStep(RFC_SECRET, totpCode(RFC_SECRET, now + 90_000), now)).toBeNull();
  });

  it('refuses anything that is not six digits', () => {
    for (const code of ['', '12345', '1234567', 'abcdef', '12 345', '０１２３４５']) {
      expect(matchTotpStep(RFC_SECRET, code)).toBeNull();
    }
  });

  it('makes 160-bit base32 secrets and a standard otpauth URI for authenticator apps', () => {
    const secret = newTotpSecret();
    expect(secret).toMatch(/^[A-Z2-7]{32}$/);
    const uri = new URL(totpUri(secret, 'someone@example.com'));
    expect(uri.protocol).toBe('otpauth:');
    expect(uri.searchParams.get('secret')).toBe(secret);
    expect(uri.searchParams.get('issuer')).toBe('Wardbook');
    expect(uri.searchParams.get('digits')).toBe('6');
    expect(uri.searchParams.get('period')).toBe('30');
  });
});
