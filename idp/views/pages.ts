import { errorSummary, field, page } from './layout';
import { html, trusted } from '../../server/http/html';

export function loginPage(options: { uid: string; email?: string; error?: string }) {
  return page({
    title: 'Sign in',
    body: html`<h1>Sign in to Wardbook</h1>
      ${errorSummary(options.error)}
      <form method="post" action="/interaction/${options.uid}/login" novalidate>
        ${field({
          name: 'email',
          label: 'E-mail address',
          type: 'email',
          value: options.email,
          autocomplete: 'username',
          autofocus: !options.email,
        })}
        ${field({
          name: 'password',
          label: 'Password',
          type: 'password',
          autocomplete: 'current-password',
          autofocus: Boolean(options.email),
        })}
        <button class="primary" type="submit">Sign in</button>
      </form>
      <p class="links">
        <a href="/password/forgot">Forgotten your password?</a>
        <a href="/interaction/${options.uid}/abort">Cancel sign-in</a>
      </p>`,
  });
}

/** The 6-digit code field and its buttons, shared by sign-in and enrolment. */
function codeForm(options: { uid: string; label: string; hint?: string; submit: string }) {
  return html`<form method="post" action="/interaction/${options.uid}/totp" novalidate>
      ${field({
        name: 'code',
        label: options.label,
        hint: options.hint,
        inputmode: 'numeric',
        autocomplete: 'one-time-code',
        pattern: '[0-9]{6}',
        autofocus: true,
      })}
      <button class="primary" type="submit">${options.submit}</button>
    </form>
    <p class="links"><a href="/interaction/${options.uid}/abort">Cancel sign-in</a></p>`;
}

export function secondFactorPage(options: { uid: string; error?: string }) {
  return page({
    title: 'One-time code',
    body: html`<h1>Enter your one-time code</h1>
      <p>
        Open the authenticator app on your phone and type the 6-digit code it shows for Wardbook.
      </p>
      ${errorSummary(options.error)}
      ${codeForm({ uid: options.uid, label: 'One-time code', submit: 'Continue' })}`,
  });
}

export function enrolmentPage(options: {
  uid: string;
  secret: string;
  qrDataUrl: string;
  error?: string;
}) {
  const grouped = options.secret.match(/.{1,4}/g)?.join(' ') ?? options.secret;
  return page({
    title: 'Set up your one-time codes',
    body: html`<h1>Set up your one-time codes</h1>
      <p>
        Engineers, office staff and monitoring operators sign in with a password and a code from an
        authenticator app. Scan this with the app, or type the key in by hand.
      </p>
      <figure class="qr">
        <img
          src="${options.qrDataUrl}"
          width="200"
          height="200"
          alt="QR code for your authenticator app"
        />
        <figcaption>
          Key: <code class="mono" data-totp-secret="${options.secret}">${grouped}</code>
        </figcaption>
      </figure>
      ${errorSummary(options.error)}
      ${codeForm({
        uid: options.uid,
        label: 'Code shown by the app',
        hint: 'Six digits. A new code appears every 30 seconds.',
        submit: 'Confirm and sign in',
      })}`,
  });
}

export function forgotPasswordPage(options: { error?: string; email?: string } = {}) {
  return page({
    title: 'Reset your password',
    body: html`<h1>Reset your password</h1>
      <p>
        Enter the e-mail address you sign in with. We will send a link to choose a new password.
      </p>
      ${options.error ? html`<div class="notice notice-alarm" role="alert">${options.error}</div>` : ''}
      <form method="post" action="/password/forgot" novalidate>
        ${field({
          name: 'email',
          label: 'E-mail address',
          type: 'email',
          value: options.email,
          autocomplete: 'username',
          autofocus: true,
        })}
        <button class="primary" type="submit">Send reset link</button>
      </form>`,
  });
}

export function messagePage(options: {
  title: string;
  message: string;
  link?: { href: string; text: string };
}) {
  return page({
    title: options.title,
    body: html`<h1>${options.title}</h1>
      <p>${options.message}</p>
      ${options.link ? html`<p><a class="button" href="${options.link.href}">${options.link.text}</a></p>` : ''}`,
  });
}

export function resetPasswordPage(options: {
  token: string;
  purpose: 'reset' | 'invitation';
  error?: string;
}) {
  const heading =
    options.purpose === 'invitation' ? 'Choose your password' : 'Choose a new password';
  return page({
    title: heading,
    body: html`<h1>${heading}</h1>
      <p>Use at least 12 characters. A few unrelated words make a strong, memorable password.</p>
      ${options.error ? html`<div class="notice notice-alarm" role="alert">${options.error}</div>` : ''}
      <form method="post" action="/password/reset/${options.token}" novalidate>
        ${field({
          name: 'password',
          label: 'New password',
          type: 'password',
          autocomplete: 'new-password',
          minlength: 12,
          autofocus: true,
        })}
        ${field({
          name: 'confirm',
          label: 'New password again',
          type: 'password',
          autocomplete: 'new-password',
          minlength: 12,
        })}
        <button class="primary" type="submit">Save password</button>
      </form>`,
  });
}

/** oidc-provider supplies the form (with its own anti-forgery field); we supply the page. */
export function logoutPage(options: { form: string; automatic: boolean }) {
  return page({
    title: 'Sign out',
    scripts: options.automatic ? ['/static/sign-out.js'] : [],
    body: html`<h1>Sign out of Wardbook</h1>
      <p>
        ${options.automatic ? 'Signing you out…' : 'Do you want to sign out of Wardbook on this device?'}
      </p>
      ${trusted(options.form)}
      <div class="actions">
        <button class="primary" type="submit" form="op.logoutForm" name="logout" value="yes">
          Sign out
        </button>
        <button class="secondary" type="submit" form="op.logoutForm">Stay signed in</button>
      </div>`,
  });
}

export function errorPage(options: { title: string; message: string; appUrl: string }) {
  return messagePage({
    title: options.title,
    message: options.message,
    link: { href: `${options.appUrl}/`, text: 'Back to Wardbook' },
  });
}
