import express, { type Express } from 'express';
import helmet from 'helmet';
import { html } from '../../http/html';
import type { Mailbox } from './mailbox';

function page(title: string, body: ReturnType<typeof html>) {
  return html`<!doctype html>
    <html lang="en-GB">
      <head>
        <meta charset="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <title>${title} · Wardbook local mail</title>
        <link rel="stylesheet" href="/viewer.css" />
      </head>
      <body>
        <header>
          <strong>Wardbook local mail</strong> — e-mail sent by this machine's Wardbook. Nothing
          leaves it.
        </header>
        <main>${body}</main>
      </body>
    </html>`.value;
}

const CSS = `body{margin:0;font:15px/1.5 system-ui,sans-serif;background:#F8F6F1;color:#14213D}
header{background:#14213D;color:#fff;padding:.75rem 1.25rem}main{max-width:60rem;margin:1.5rem auto;padding:0 1rem}
table{width:100%;border-collapse:collapse;background:#fff;border:1px solid #d9d4c7}th,td{text-align:left;padding:.5rem .75rem;border-bottom:1px solid #e6e1d6}
pre{white-space:pre-wrap;background:#fff;border:1px solid #d9d4c7;padding:1rem}a{color:#14213D}`;

/** Read-only web page and JSON over the captured mail; tests use the JSON. */
export function createMailViewer(mailbox: Mailbox): Express {
  const app = express();
  app.disable('x-powered-by');
  app.use(
    helmet({
      strictTransportSecurity: false,
      contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } },
    }),
  );

  app.get('/viewer.css', (_req, res) => {
    res.type('css').send(CSS);
  });
  app.get('/api/messages', (_req, res) => {
    res.json(mailbox.list());
  });
  app.delete('/api/messages', (_req, res) => {
    mailbox.clear();
    res.status(204).end();
  });
  app.get('/', (_req, res) => {
    const mails = mailbox.list();
    res.type('html').send(
      page(
        'Inbox',
        html`<h1>Inbox (${mails.length})</h1>
          ${
            mails.length === 0
              ? html`<p>No e-mail yet. Password resets and invitations appear here.</p>`
              : html`<table>
                  <thead>
                    <tr>
                      <th scope="col">Received</th>
                      <th scope="col">To</th>
                      <th scope="col">Subject</th>
                    </tr>
                  </thead>
                  <tbody>
                    ${mails.map(
                      (mail) =>
                        html`<tr>
                          <td>${mail.receivedAt.replace('T', ' ').slice(0, 19)}</td>
                          <td>${mail.to.join(', ')}</td>
                          <td>
                            <a href="/messages/${mail.id}">${mail.subject || '(no subject)'}</a>
                          </td>
                        </tr>`,
                    )}
                  </tbody>
                </table>`
          }`,
      ),
    );
  });
  app.get('/messages/:id/attachments/:index', (req, res) => {
    const attachment = mailbox.attachment(Number(req.params.id), Number(req.params.index));
    if (!attachment) {
      res.status(404).type('text').send('No such attachment.');
      return;
    }
    res
      .type(attachment.contentType)
      .set('Content-Disposition', `attachment; filename="${attachment.filename.replace(/"/g, '')}"`)
      .send(attachment.content);
  });
  app.get('/messages/:id', (req, res) => {
    const mail = mailbox.get(Number(req.params.id));
    if (!mail) {
      res
        .status(404)
        .type('html')
        .send(page('Not found', html`<p>No such message. <a href="/">Back</a></p>`));
      return;
    }
    res.type('html').send(
      page(
        mail.subject,
        html`<p><a href="/">← Inbox</a></p>
          <h1>${mail.subject}</h1>
          <p>From ${mail.from} to ${mail.to.join(', ')} at ${mail.receivedAt}</p>
          ${
            mail.attachments.length
              ? html`<p>
                  Attachments:
                  ${mail.attachments.map(
                    (a, index) =>
                      html`<a href="/messages/${mail.id}/attachments/${index}">${a.filename}</a>
                        (${a.contentType}, ${a.size} bytes)`,
                  )}
                </p>`
              : ''
          }
          <pre>${mail.text}</pre>`,
      ),
    );
  });
  return app;
}
