import { html, type SafeHtml } from '../../server/http/html';

// The same mark as the app's (public/favicon.svg), served by the IdP under /static/brand.
const WORDMARK = html`<img
  class="mark"
  src="/static/brand/favicon.svg"
  alt=""
  width="28"
  height="28"
/>`;

export interface PageOptions {
  title: string;
  body: SafeHtml;
  /** Extra script files served by the IdP itself (the CSP allows no inline script). */
  scripts?: string[];
}

export function page({ title, body, scripts = [] }: PageOptions): string {
  return html`<!doctype html>
    <html lang="en-GB">
      <head>
        <meta charset="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <meta name="robots" content="noindex" />
        <title>${title} · Wardbook</title>
        <link rel="icon" type="image/svg+xml" href="/static/brand/favicon.svg" />
        <link rel="stylesheet" href="/static/idp.css" />
        ${scripts.map((src) => html`<script src="${src}" defer></script>`)}
      </head>
      <body>
        <a class="skip" href="#main">Skip to content</a>
        <header class="top">
          <span class="brand">${WORDMARK}<span>Wardbook</span></span>
          <span class="tag">Sign-in service</span>
        </header>
        <main id="main" class="sheet">${body}</main>
        <footer class="foot">
          Wardbook keeps the record of every alarm system your installer looks after.
        </footer>
      </body>
    </html>`.value;
}

export function errorSummary(message: string | undefined): SafeHtml {
  if (!message) return html``;
  return html`<div class="notice notice-alarm" role="alert">
    <strong>Not signed in.</strong> ${message}
  </div>`;
}

export function field(options: {
  name: string;
  label: string;
  type?: string;
  value?: string;
  autocomplete?: string;
  hint?: string;
  inputmode?: string;
  pattern?: string;
  autofocus?: boolean;
  minlength?: number;
}): SafeHtml {
  const id = `field-${options.name}`;
  const hintId = options.hint ? `${id}-hint` : undefined;
  return html`<div class="field">
    <label for="${id}">${options.label}</label>
    ${options.hint ? html`<p class="hint" id="${hintId}">${options.hint}</p>` : ''}
    <input
      id="${id}"
      name="${options.name}"
      type="${options.type ?? 'text'}"
      value="${options.value ?? ''}"
      ${options.autocomplete ? html`autocomplete="${options.autocomplete}"` : ''}
      ${options.inputmode ? html`inputmode="${options.inputmode}"` : ''}
      ${options.pattern ? html`pattern="${options.pattern}"` : ''}
      ${options.minlength ? html`minlength="${options.minlength}"` : ''}
      ${hintId ? html`aria-describedby="${hintId}"` : ''}
      ${options.autofocus ? html`autofocus` : ''}
      required
    />
  </div>`;
}
