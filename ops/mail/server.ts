import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { createPgPool } from '../../api/src/lib/pg-pool.js';

export interface MailServer {
  port: number;
  /** Messages accepted but not stored again because their Message-ID was already captured. */
  readonly repeatsDropped: number;
  close(): Promise<void>;
}

const addresses = (field: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(field) ? field : field ? [field] : [])
    .flatMap((a) => a.value.map((v) => v.address ?? ''))
    .filter(Boolean);

/**
 * The local SMTP server: accepts every message on 127.0.0.1 and stores it in dev_mail, where
 * admins read it through /api/v1/dev/mail. It stands in for the site's mail relay.
 */
export async function startMailServer(options: { port: number; databaseUrl: string }): Promise<MailServer> {
  const pool = createPgPool(options.databaseUrl, 2);
  let repeatsDropped = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    banner: 'Shadowloop local mail capture',
    size: 5 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const to = addresses(mail.to);
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          // A sender that retries after a lost reply repeats the Message-ID: store the message once.
          const stored = await pool.query(
            `INSERT INTO dev_mail (message_id, from_address, to_addresses, subject, text, html)
             VALUES ($1, $2, $3, $4, $5, $6) ON CONFLICT DO NOTHING`,
            [
              mail.messageId ?? null,
              addresses(mail.from)[0] ?? null,
              to.length ? to : envelopeTo,
              mail.subject ?? '',
              mail.text ?? '',
              typeof mail.html === 'string' ? mail.html : null,
            ],
          );
          if (stored.rowCount === 0) repeatsDropped++;
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve) => server.listen(options.port, '127.0.0.1', resolve));
  return {
    port: (server.server.address() as AddressInfo).port,
    get repeatsDropped() {
      return repeatsDropped;
    },
    close: async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await pool.end();
    },
  };
}
