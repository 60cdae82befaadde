import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Readable } from 'node:stream';
import { Waiters } from '../waiters';

export interface CapturedMail {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: { filename: string; contentType: string; size: number }[];
}

const KEEP = 500;

/** Attachment bytes are kept beside the message so the viewer can hand them back. */
export type CapturedAttachment = CapturedMail['attachments'][number] & { content: Buffer };

/**
 * A local stand-in for an SMTP relay: accepts every message on loopback, keeps the newest in
 * memory, and lets people (the viewer) and tests read what arrived.
 */
export class Mailbox {
  private nextId = 1;
  private mails: CapturedMail[] = [];
  private contents = new Map<number, Buffer[]>();
  private waiters = new Waiters();

  list(): CapturedMail[] {
    return [...this.mails].reverse();
  }

  get(id: number): CapturedMail | undefined {
    return this.mails.find((mail) => mail.id === id);
  }

  clear() {
    this.mails = [];
    this.contents.clear();
  }

  attachment(id: number, index: number): CapturedAttachment | undefined {
    const mail = this.get(id);
    const meta = mail?.attachments[index];
    const content = this.contents.get(id)?.[index];
    return meta && content ? { ...meta, content } : undefined;
  }

  async add(stream: Readable) {
    const parsed = await simpleParser(stream);
    const to = (Array.isArray(parsed.to) ? parsed.to : parsed.to ? [parsed.to] : []).flatMap(
      (address) => address.value.map((entry) => entry.address ?? ''),
    );
    const id = this.nextId++;
    this.contents.set(
      id,
      parsed.attachments.map((attachment) => attachment.content),
    );
    this.mails.push({
      id,
      receivedAt: new Date().toISOString(),
      from: parsed.from?.text ?? '',
      to,
      subject: parsed.subject ?? '',
      text: parsed.text ?? '',
      html: typeof parsed.html === 'string' ? parsed.html : null,
      attachments: parsed.attachments.map((attachment) => ({
        filename: attachment.filename ?? 'attachment',
        contentType: attachment.contentType,
        size: attachment.size,
      })),
    });
    if (this.mails.length > KEEP) {
      for (const dropped of this.mails.splice(0, this.mails.length - KEEP))
        this.contents.delete(dropped.id);
    }
    this.waiters.wake();
  }

  /** Resolves with the first message to `address` matching the filter, waiting if needed. */
  waitFor(predicate: (item: CapturedMail) => boolean, timeoutMs = 10_000): Promise<CapturedMail> {
    return this.waiters.waitFor(() => this.mails.find(predicate), timeoutMs, 'e-mail');
  }
}

export function createSmtpServer(mailbox: Mailbox): SMTPServer {
  return new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Wardbook local mail catcher',
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, _session, callback) {
      mailbox.add(stream).then(
        () => callback(),
        (error: Error) => callback(error),
      );
    },
  });
}
