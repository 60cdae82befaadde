import { createServer, type AddressInfo, type Socket } from 'node:net';
import { ackFor, nak, parseFrame } from '../server/monitoring/protocol/dc09';

/**
 * The yardstick for the signal bench, in its own process like the real receiver: DC-09 frames
 * read between LF and CR and checked by the same parser, but "stored" in a Set in memory, so an
 * ACK costs no database round trip. The real receiver's figures are read against this one's.
 * Prints "listening <port>" when ready.
 */
const seen = new Set<string>();

const server = createServer((socket: Socket) => {
  socket.setEncoding('latin1');
  socket.on('error', () => socket.destroy());
  let buffer = '';
  socket.on('data', (chunk: string) => {
    buffer += chunk;
    for (;;) {
      const start = buffer.indexOf('\n');
      const end = start === -1 ? -1 : buffer.indexOf('\r', start);
      if (end === -1) break;
      const parsed = parseFrame(buffer.slice(start, end + 1));
      buffer = buffer.slice(end + 1);
      if (!parsed.ok) {
        socket.write(nak(new Date()), 'latin1');
        continue;
      }
      seen.add(`${parsed.frame.account}/${parsed.frame.sequence}/${parsed.frame.data}`);
      socket.write(ackFor(parsed.frame), 'latin1');
    }
  });
});

server.listen(0, '127.0.0.1', () => {
  console.log(`listening ${(server.address() as AddressInfo).port}`);
});
process.on('SIGTERM', () => process.exit(0));
