import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../server/config/config';
import { html, trusted } from '../../server/http/html';
import { repoRoot } from '../../server/paths';

describe('loadConfig', () => {
  it('gives a working local set-up with no settings at all', () => {
    const config = loadConfig({});
    expect(config.postgres).toEqual({
      host: '127.0.0.1',
      port: 54329,
      database: 'wardbook',
      user: 'postgres',
    });
    expect(config.api.publicUrl).toBe('http://127.0.0.1:3000');
    expect(config.idp.issuer).toBe('http://127.0.0.1:3001');
    expect(config.idp.appOrigins).toEqual(['http://127.0.0.1:3000', 'http://127.0.0.1:5173']);
    expect(config.dataDir).toBe(path.join(repoRoot, '.data'));
  });

  it('follows a changed API port into the sign-in redirect origins', () => {
    const config = loadConfig({
      WARDBOOK_API_PORT: '4100',
      WARDBOOK_PUBLIC_URL: 'https://alarms.example.com/',
    });
    expect(config.api.port).toBe(4100);
    expect(config.idp.appOrigins[0]).toBe('https://alarms.example.com');
  });

  it('lists every bad setting at once', () => {
    expect(() => loadConfig({ WARDBOOK_PG_PORT: 'lots', WARDBOOK_DB_NAME: 'Drop Table' })).toThrow(
      ConfigError,
    );
    try {
      loadConfig({ WARDBOOK_PG_PORT: 'lots', WARDBOOK_DB_NAME: 'Drop Table' });
    } catch (error) {
      expect((error as Error).message).toMatch(/WARDBOOK_PG_PORT/);
      expect((error as Error).message).toMatch(/WARDBOOK_DB_NAME/);
    }
  });
});

describe('html', () => {
  it('escapes interpolated text and keeps trusted markup', () => {
    const name = `<script>alert("x")</script> & 'co'`;
    expect(html`<p>${name}</p>`.value).toBe(
      '<p>&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;co&#39;</p>',
    );
    expect(html`<div>${trusted('<b>ok</b>')}</div>`.value).toBe('<div><b>ok</b></div>');
    const items = ['a', '<b>'].map((item) => html`<li>${item}</li>`);
    // prettier-ignore
    expect(html`<ul>${items}</ul>`.value).toBe('<ul><li>a</li><li>&lt;b&gt;</li></ul>');
    expect(html`${null}${undefined}${false}${0}`.value).toBe('0');
  });
});
