// Sends e-mail through nodemailer over SMTP: to SMTP_URL when configured, else to the local sink.
import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  kind: 'smtp' | 'local-sink';
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export function createMailer(options: { smtpUrl?: string; sinkPort?: number; from: string }): Mailer {
  const transport = options.smtpUrl
    ? nodemailer.createTransport(options.smtpUrl)
    : nodemailer.createTransport({ host: '127.0.0.1', port: options.sinkPort, secure: false, ignoreTLS: true });
  return {
    kind: options.smtpUrl ? 'smtp' : 'local-sink',
    async send(mail) {
      await transport.sendMail({ from: options.from, ...mail });
    },
    close: () => transport.close(),
  };
}
