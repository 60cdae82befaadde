import { totpCode } from '../../idp/totp';

// `npm run totp -- <base32 secret>`: prints the current one-time code, for the demo accounts
// when no authenticator app is at hand. Local use only.
const secret = process.argv[2];
if (!secret || !/^[A-Z2-7]+=*$/i.test(secret)) {
  console.error('Usage: npm run totp -- <base32 secret from README.md>');
  process.exit(1);
}
const secondsLeft = 30 - (Math.floor(Date.now() / 1000) % 30);
console.log(`${totpCode(secret.toUpperCase())}  (valid for ${secondsLeft} more seconds)`);
