import { describe, expect, it } from 'vitest';
import { passwordProblem } from '../../idp/passwords';
import { safeReturnPath } from '../../server/auth/service';

describe('safeReturnPath', () => {
  it('keeps paths inside the app', () => {
    expect(safeReturnPath('/engineer')).toBe('/engineer');
    expect(safeReturnPath('/homeowner?tab=documents')).toBe('/homeowner?tab=documents');
  });

  it('sends anything that could leave the site, or loop, to /app', () => {
    for (const value of [
      'https://example.com/',
      '//example.com/',
      '/\\example.com',
      'javascript:alert(1)',
      '/auth/login',
      '',
      undefined,
      42,
    ]) {
      expect(safeReturnPath(value)).toBe('/app');
    }
  });
});

describe('passwordProblem', () => {
  it('asks for 12 characters, a matching confirmation, and nothing built from the e-mail', () => {
    expect(passwordProblem('short', 'short', 'a@example.com')).toBe('Use at least 12 characters.');
    expect(passwordProblem('long enough words', 'long enough wordz', 'a@example.com')).toBe(
      'The two passwords are not the same.',
    );
    expect(
      passwordProblem('helen.marsh-2026!', 'helen.marsh-2026!', 'helen.marsh@example.com'),
    ).toBe('Do not build the password from your e-mail address.');
    expect(
      passwordProblem('brass ink paper lamp', 'brass ink paper lamp', 'a@example.com'),
    ).toBeUndefined();
  });
});
