import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** Sends through SMTP with nodemailer (the fake server in development and tests, a real relay in production). */
export function createMailer(options: { host: string; port: number; from: string; ignoreTls?: boolean }): Mailer {
  const transport = nodemailer.createTransport({
    host: options.host,
    port: options.port,
    secure: false,
    ignoreTLS: options.ignoreTls ?? false,
    // A relay that accepts the connection and then hangs is given up on instead of holding the socket for minutes
    // (nodemailer's own defaults are 30 s for the greeting and 10 min of silence); the outbox bounds each attempt too.
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: options.from, ...mail });
    },
    close() {
      transport.close();
    },
  };
}
