import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { dataSource } from '../db/dataSource';

/**
 * The local mail sink: an SMTP server on loopback that keeps every message it receives in
 * PostgreSQL (table mail_messages), where the admin's outbox page reads them. Nothing leaves the machine.
 */
export async function startMailSink(port: number, host = '127.0.0.1'): Promise<{ port: number; close(): Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks);
          const parsed = await simpleParser(raw);
          const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
          await dataSource.query(
            'INSERT INTO mail_messages (mail_from, recipients, subject, body, raw) VALUES ($1, $2, $3, $4, $5)',
            [from, session.envelope.rcptTo.map((r) => r.address), parsed.subject ?? '', parsed.text ?? '', raw],
          );
          callback();
        } catch (err) {
          callback(err as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve());
  });
  const address = server.server.address();
  return {
    port: typeof address === 'object' && address ? address.port : port,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
