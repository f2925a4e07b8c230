import nodemailer from 'nodemailer';
import type { Config } from '../config';
import { HttpError } from '../http/errors';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

/** Sends one message; resolves once the relay has accepted it. */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/**
 * nodemailer's SMTP transport pointed at the configured relay: a real one in
 * `smtp` mode, the local fake (on `fakePort`) otherwise. Swapping relays is
 * configuration only.
 */
export function smtpMailer(config: Config, fakePort?: number): Mailer {
  const from = config.mail.from;
  const transport =
    config.mail.mode === 'smtp'
      ? nodemailer.createTransport(config.mail.url)
      : nodemailer.createTransport({ host: '127.0.0.1', port: fakePort ?? config.mail.fakePort, secure: false, ignoreTLS: true });
  return {
    async send(mail) {
      await transport.sendMail({ from, to: mail.to, subject: mail.subject, text: mail.text, textEncoding: 'quoted-printable' });
    },
  };
}

/** Used when no relay is running (an app built for tests that send no mail). */
export const noMailer: Mailer = {
  async send() {
    throw new HttpError(503, 'mail-unavailable', 'Mail is not set up on this server, so no message was sent.');
  },
};
