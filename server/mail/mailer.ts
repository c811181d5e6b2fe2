import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../config';

export interface MailMessage {
  to: string[];
  subject: string;
  text: string;
}

export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): void;
}

/**
 * Mail over SMTP. By default to the local mail sink that npm start and npm test run (server/mail/sink.ts);
 * SMTP_HOST, SMTP_PORT, SMTP_USER, SMTP_PASSWORD and SMTP_SECURE point it at a real service instead.
 */
export function createMailer(port = config.smtp.port): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    host: config.smtp.host,
    port,
    secure: config.smtp.secure,
    ignoreTLS: !config.smtp.secure && config.smtp.host === '127.0.0.1',
    auth: config.smtp.user ? { user: config.smtp.user, pass: config.smtp.password } : undefined,
  });
  return {
    async send({ to, subject, text }) {
      if (!to.length) return;
      await transport.sendMail({ from: config.smtp.from, to, subject, text });
    },
    close: () => transport.close(),
  };
}
