import type { AddressInfo } from 'node:net';
import { simpleParser, type ParsedMail } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface SmtpSink {
  port: number;
  /** Messages accepted, parsed. */
  messages: ParsedMail[];
  /** Every DATA command received, accepted or refused. */
  attempts(): number;
  /** Refuse the next `count` messages with `451 Try again later`. */
  refuseNext(count: number): void;
  close(): Promise<void>;
}

/** An in-process SMTP server on 127.0.0.1 (a free port unless given) that keeps what it receives. */
export async function startSmtpSink(port = 0): Promise<SmtpSink> {
  const messages: ParsedMail[] = [];
  let attempts = 0;
  let refusing = 0;
  const server = new SMTPServer({
    // Its built-in certificate is expired: plain SMTP only.
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    logger: false,
    onData(stream, _session, callback) {
      attempts++;
      const refuse = refusing > 0;
      if (refuse) refusing--;
      simpleParser(stream).then(
        (mail) => {
          if (refuse) {
            callback(Object.assign(new Error('Try again later'), { responseCode: 451 }));
          } else {
            messages.push(mail);
            callback();
          }
        },
        (error: Error) => callback(error),
      );
    },
  });
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', () => resolve()));
  const address = server.server.address() as AddressInfo;
  return {
    port: address.port,
    messages,
    attempts: () => attempts,
    refuseNext(count) {
      refusing = count;
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
