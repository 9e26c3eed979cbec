import { SMTPServer } from 'smtp-server';
import type { AddressInfo } from 'node:net';

export interface CapturedMail {
  from: string;
  to: string[];
  raw: string;
  receivedAt: Date;
}

/** The local stand-in for an SMTP relay: accepts every message on 127.0.0.1 and keeps it in memory.
 * Used when SMTP_URL is not set (development, tests); the Outbox page shows what was sent. */
export async function startFakeSmtpServer(port = 0): Promise<{ url: string; messages: CapturedMail[]; close: () => Promise<void> }> {
  const messages: CapturedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        messages.push({
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          raw: Buffer.concat(chunks).toString('utf8'),
          receivedAt: new Date(),
        });
        callback();
      });
    },
  });
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
  const address = server.server.address() as AddressInfo;
  return {
    url: `smtp://127.0.0.1:${address.port}?ignoreTLS=true`,
    messages,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
