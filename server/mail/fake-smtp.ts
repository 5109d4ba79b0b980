/**
 * The local fake SMTP server for development and tests: accepts every mail on 127.0.0.1 and keeps it in memory,
 * newest first, for the development mailbox (GET /api/dev/mail). Nothing is delivered anywhere.
 */
import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { DevMail } from '../../shared/contracts/app-config';

const keptMails = 200;

export interface FakeSmtp {
  host: string;
  port: number;
  /** Caught mails, newest first. */
  mails(): DevMail[];
  clear(): void;
  close(): Promise<void>;
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  if (!value) return [];
  const list = Array.isArray(value) ? value : [value];
  return list.flatMap((entry) => entry.value.map((address) => address.address ?? '')).filter(Boolean);
}

function listen(server: SMTPServer, port: number, host: string): Promise<void> {
  return new Promise((resolvePromise, reject) => {
    const onError = (error: Error) => {
      server.server.off('listening', onListening);
      reject(error);
    };
    const onListening = () => {
      server.server.off('error', onError);
      resolvePromise();
    };
    server.server.once('error', onError);
    server.server.once('listening', onListening);
    server.listen(port, host);
  });
}

/** Starts the fake SMTP server on host:port; when the port is taken, on a free one (said in the log). */
export async function startFakeSmtp(options: { host?: string; port?: number; log?: (line: string) => void } = {}): Promise<FakeSmtp> {
  const host = options.host ?? '127.0.0.1';
  const mails: DevMail[] = [];
  const create = () => {
    const created = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      banner: 'Stillspan development mail catcher',
      onData(stream, session, callback) {
        simpleParser(stream)
          .then((parsed) => {
            const to = addresses(parsed.to);
            mails.unshift({
              id: randomUUID(),
              from: addresses(parsed.from)[0] ?? session.envelope.mailFrom?.toString() ?? '',
              to: to.length > 0 ? to : session.envelope.rcptTo.map((rcpt) => rcpt.address),
              subject: parsed.subject ?? '',
              text: parsed.text ?? '',
              html: typeof parsed.html === 'string' ? parsed.html : null,
              receivedAt: new Date().toISOString(),
            });
            mails.length = Math.min(mails.length, keptMails);
            callback();
          })
          .catch((error: Error) => callback(error));
      },
    });
    // A failed listen is reported through listen() below; SMTPServer re-emits it as 'error' too.
    created.on('error', () => undefined);
    return created;
  };
  let server = create();
  try {
    await listen(server, options.port ?? 0, host);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'EADDRINUSE' || !options.port) throw error;
    server = create();
    await listen(server, 0, host);
    options.log?.(`port ${options.port} is taken; the fake SMTP server uses ${(server.server.address() as AddressInfo).port} instead`);
  }
  server.on('error', (error) => options.log?.(`fake SMTP error: ${error.message}`));
  const port = (server.server.address() as AddressInfo).port;
  return {
    host,
    port,
    mails: () => mails.slice(),
    clear: () => {
      mails.length = 0;
    },
    close: () => new Promise<void>((resolvePromise) => server.close(() => resolvePromise())),
  };
}
