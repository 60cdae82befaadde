import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** SMTP through nodemailer; locally that is the SMTP fake started by `npm start`. */
export function createSmtpMailer(options: { host: string; port: number; from: string }): Mailer {
  const transport = nodemailer.createTransport({
    host: options.host,
    port: options.port,
    secure: false,
    // The local fake speaks plain SMTP on loopback; a real relay would be configured with TLS.
    ignoreTLS: options.host === '127.0.0.1',
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: options.from, ...mail });
    },
    close: () => transport.close(),
  };
}
