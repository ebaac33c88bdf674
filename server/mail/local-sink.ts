// A local SMTP server that catches every outgoing message and keeps it in the database for the outbox page.
// Used only when no SMTP_URL is configured, so a developer's machine never sends real mail.
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { Database } from '../../db/client';
import { mailMessage } from '../../db/schema';

export interface LocalSink {
  port: number;
  close(): Promise<void>;
}

const addresses = (a: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((o) => o.value.map((v) => v.address ?? '')).filter(Boolean);

export async function startLocalSink(db: Database, log: (line: string) => void): Promise<LocalSink> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          await db.insert(mailMessage).values({
            fromAddress: parsed.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            toAddresses: envelopeTo.length > 0 ? envelopeTo : addresses(parsed.to),
            subject: parsed.subject ?? '(no subject)',
            textBody: parsed.text ?? '',
            htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
          });
          callback();
        })
        .catch((err: unknown) => {
          log(`local mail sink: could not store a message: ${String(err)}`);
          callback(err instanceof Error ? err : new Error(String(err)));
        });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}
