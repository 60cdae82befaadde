import { createServer } from 'node:http';
import { loadConfig } from '../../config/config';
import { loadOrCreateSecrets } from '../../config/secrets';
import { createTwilioFake } from './app';

// The local Twilio fake started by `npm start`: the Messages API the app's SDK talks to, and a
// page to read texts and reply as a keyholder.
const config = loadConfig();
const secrets = loadOrCreateSecrets(config.dataDir);
const fake = createTwilioFake({
  accountSid: config.twilio.accountSid,
  authToken: secrets.twilioAuthToken,
  publicUrl: config.twilio.apiBaseUrl,
  inboundWebhookUrl: config.twilio.inboundWebhookUrl,
  phoneNumber: config.twilio.from,
});
const server = createServer(fake.app);

server.listen(config.twilio.port, '127.0.0.1', () => {
  console.log(`Twilio fake and SMS page on http://127.0.0.1:${config.twilio.port}`);
});

function shutdown() {
  fake.close();
  server.closeAllConnections();
  server.close(() => process.exit(0));
}
process.once('SIGINT', shutdown);
process.once('SIGTERM', shutdown);
