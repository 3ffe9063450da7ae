/**
 * The local SMTP server the project starts in development and tests (never in production): it
 * accepts every message on 127.0.0.1 and keeps it in the caught_mail table, where /admin/mail and
 * GET /api/dev/mail show it. Started and stopped by scripts/lib.mjs through a pid file.
 */
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { createDb } from '@db/connection';
import { readDbConfig } from '@db/config';

const port = Number(process.env.BONDMAP_SMTP_PORT ?? 2525);
const db = createDb({ ...readDbConfig(), poolMax: 2 });

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS', 'AUTH'],
  // The per-start token in the greeting lets scripts/lib.mjs tell this catcher from anyone else's.
  banner: `Bondmap local mail catcher ${process.env.BONDMAP_CATCHER_TOKEN ?? ''}`.trim(),
  size: 10 * 1024 * 1024,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on('data', (chunk: Buffer) => chunks.push(chunk));
    stream.on('end', async () => {
      try {
        const raw = Buffer.concat(chunks).toString('utf8');
        const parsed = await simpleParser(raw);
        await db.models.CaughtMail.create({
          mailFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          recipients: session.envelope.rcptTo.map((r) => r.address).join(', '),
          subject: parsed.subject ?? '',
          textBody: parsed.text ?? '',
          htmlBody: typeof parsed.html === 'string' ? parsed.html : null,
          raw,
        });
        callback();
      } catch (error) {
        // Tell the sender to try again later; the app's outbox will.
        callback(Object.assign(new Error(`could not store the message: ${(error as Error).message}`), { responseCode: 451 }));
      }
    });
  },
});

server.on('error', (error) => console.error('[mail-catcher]', error.message));
server.listen(port, '127.0.0.1', () => console.error(`[mail-catcher] listening on 127.0.0.1:${port}`));

const stop = () => server.close(() => db.sequelize.close().finally(() => process.exit(0)));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
