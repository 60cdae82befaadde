import { html, type SafeHtml } from '../../http/html';
import type { StoredMessage, WebhookAttempt } from './inbox';

export const PAGE_CSS = `body{margin:0;font:15px/1.5 system-ui,sans-serif;background:#F8F6F1;color:#14213D}
header{background:#14213D;color:#fff;padding:.75rem 1.25rem}main{max-width:48rem;margin:1.5rem auto;padding:0 1rem}
a{color:#14213D}section,form.start{background:#fff;border:1px solid #d9d4c7;padding:1rem;margin:0 0 1.25rem}
h2{margin:0 0 .5rem;font-size:1.1rem}ol{list-style:none;margin:0;padding:0}
li{margin:.5rem 0;max-width:85%;padding:.5rem .75rem;border:1px solid #d9d4c7;border-radius:.5rem}
li.outbound{background:#F8F6F1}li.inbound{background:#E4E9F2;margin-left:auto}
.meta{font-size:.8rem;color:#3d4a66}.text{white-space:pre-wrap;margin:.25rem 0 0}
label{display:block;font-weight:600;margin:.75rem 0 .25rem}input,textarea{font:inherit;width:100%;box-sizing:border-box;padding:.5rem;border:1px solid #8a93a6}
button{font:inherit;margin-top:.5rem;min-height:44px;padding:0 1rem;background:#14213D;color:#fff;border:0;border-radius:.25rem;cursor:pointer}
:focus-visible{outline:3px solid #C2410C;outline-offset:2px}dl{display:grid;grid-template-columns:max-content 1fr;gap:.25rem 1rem}dd{margin:0;word-break:break-all}`;

function page(title: string, body: SafeHtml) {
  return html`<!doctype html>
    <html lang="en-GB">
      <head>
        <meta charset="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <title>${title} · Wardbook local SMS</title>
        <link rel="stylesheet" href="/fake.css" />
      </head>
      <body>
        <header>
          <strong>Wardbook local SMS</strong> — text messages sent by this machine's Wardbook.
          Nothing leaves it; replies you type here go to the app as a keyholder's phone would.
        </header>
        <main>${body}</main>
      </body>
    </html>`.value;
}

export function renderProblem(message: string) {
  return page(
    'Not sent',
    html`<h1>Not sent</h1>
      <p>${message}</p>
      <p><a href="/">Back</a></p>`,
  );
}

interface Conversation {
  /** The keyholder's number: the other side from Wardbook's. */
  party: string;
  /** Wardbook's number in this conversation, which a reply goes to. */
  ours: string;
  messages: StoredMessage[];
}

/** Groups messages by the keyholder's number, busiest-most-recently first. */
function conversations(newestFirst: StoredMessage[]): Conversation[] {
  const byParty = new Map<string, Conversation>();
  for (const message of newestFirst) {
    const party = message.direction === 'outbound' ? message.to : message.from;
    const ours = message.direction === 'outbound' ? message.from : message.to;
    const conversation = byParty.get(party) ?? { party, ours, messages: [] };
    conversation.messages.unshift(message);
    byParty.set(party, conversation);
  }
  return [...byParty.values()];
}

function describeWebhook(attempt: WebhookAttempt) {
  if (attempt.error) return `${attempt.status}: not delivered to the app (${attempt.error})`;
  return `${attempt.status}: app answered ${attempt.responseStatus}`;
}

function time(iso: string) {
  return iso.replace('T', ' ').slice(0, 19);
}

function renderMessage(message: StoredMessage) {
  const heading =
    message.direction === 'outbound'
      ? `Wardbook (${message.from}) → ${message.to}`
      : `${message.from} → Wardbook (${message.to})`;
  const state = message.direction === 'outbound' ? message.status : 'received';
  return html`<li class="${message.direction}">
    <div class="meta">
      ${heading} · ${time(message.dateCreated)} · <strong>${state}</strong>
      ${message.numSegments > 1 ? ` · ${message.numSegments} parts` : ''}
    </div>
    <p class="text">${message.body}</p>
    ${
      message.webhooks.length
        ? html`<div class="meta">${message.webhooks.map(describeWebhook).join('; ')}</div>`
        : ''
    }
  </li>`;
}

export function renderConversations(
  newestFirst: StoredMessage[],
  setup: { phoneNumber: string; apiBaseUrl?: string; inboundWebhookUrl?: string },
) {
  const list = conversations(newestFirst);
  return page(
    'Conversations',
    html`<h1>Conversations (${list.length})</h1>
      <p><a href="/">Refresh</a> to see new messages and delivery updates.</p>
      <dl>
        <dt>Wardbook's number</dt>
        <dd>${setup.phoneNumber}</dd>
        ${
          setup.apiBaseUrl
            ? html`<dt>API base URL</dt>
                <dd>${setup.apiBaseUrl}</dd>`
            : ''
        }
        <dt>Replies go to</dt>
        <dd>
          ${setup.inboundWebhookUrl ?? 'nowhere: no inbound webhook is set, so they stay here'}
        </dd>
      </dl>
      <form class="start" method="post" action="/replies">
        <h2>Text Wardbook as a keyholder</h2>
        <label for="start-from">From number</label>
        <input
          id="start-from"
          name="from"
          type="tel"
          required
          pattern="\\+[1-9][0-9]{1,14}"
          placeholder="+447700900123"
          autocomplete="off"
        />
        <input type="hidden" name="to" value="${setup.phoneNumber}" />
        <label for="start-body">Message</label>
        <textarea id="start-body" name="body" rows="2" required maxlength="1600"></textarea>
        <button type="submit">Send</button>
      </form>
      ${
        list.length === 0
          ? html`<p>No text messages yet. Messages Wardbook sends to keyholders appear here.</p>`
          : list.map(
              (conversation) =>
                html`<section id="conversation-${conversation.party.slice(1)}">
                  <h2>${conversation.party}</h2>
                  <ol>
                    ${conversation.messages.map(renderMessage)}
                  </ol>
                  <form method="post" action="/replies">
                    <input type="hidden" name="from" value="${conversation.party}" />
                    <input type="hidden" name="to" value="${conversation.ours}" />
                    <label for="reply-${conversation.party.slice(1)}"
                      >Reply as ${conversation.party}</label
                    >
                    <textarea
                      id="reply-${conversation.party.slice(1)}"
                      name="body"
                      rows="2"
                      required
                      maxlength="1600"
                    ></textarea>
                    <button type="submit">Send reply</button>
                  </form>
                </section>`,
            )
      }`,
  );
}
