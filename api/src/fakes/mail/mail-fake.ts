import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { MailStore } from './mail-store';

/** Limits that keep the fake from filling the disk. */
const MAX_MESSAGE_BYTES = 2 * 1024 * 1024;

/**
 * An SMTP server for development and tests: accepts every message on loopback, without
 * TLS or authentication, and stores it in a MailStore.
 */
export function createMailFake(store: MailStore, onError: (err: Error) => void = () => {}): SMTPServer {
  const server = new SMTPServer({
    name: 'seamline-mail-fake',
    banner: 'Seamline mail fake (stores messages locally; nothing is delivered)',
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream, { skipImageLinks: true })
        .then((parsed) =>
          store.save({
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            envelopeTo: session.envelope.rcptTo.map((r) => r.address),
            from: parsed.from?.text ?? '',
            to: addressText(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          }),
        )
        .then(() => callback(), (err: Error) => callback(err));
    },
  });
  server.on('error', onError);
  return server;
}

function addressText(to: AddressObject | AddressObject[] | undefined): string {
  if (!to) return '';
  return (Array.isArray(to) ? to : [to]).map((a) => a.text).join(', ');
}
