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
    connectionTimeout: 10_000,
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
