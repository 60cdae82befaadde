import { createServer } from 'node:http';
import { loadConfig } from '../../config/config';
import { createMailViewer } from './viewer';
import { createSmtpServer, Mailbox } from './mailbox';

// The local mail catcher process started by `npm start`: SMTP in, a web page to read it.
const config = loadConfig();
const mailbox = new Mailbox();
const smtp = createSmtpServer(mailbox);
const viewer = createServer(createMailViewer(mailbox));

smtp.listen(config.mail.smtpPort, '127.0.0.1', () => {
  console.log(`SMTP fake listening on 127.0.0.1:${config.mail.smtpPort}`);
});
viewer.listen(config.mail.viewerPort, '127.0.0.1', () => {
  console.log(`mail viewer on http://127.0.0.1:${config.mail.viewerPort}`);
});

function shutdown() {
  viewer.close();
  smtp.close(() => process.exit(0));
}
process.once('SIGINT', shutdown);
process.once('SIGTERM', shutdown);
