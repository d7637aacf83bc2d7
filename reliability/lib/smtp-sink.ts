import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/** One e-mail the sink accepted (answered 250 to). */
export interface Delivery {
  messageId: string;
  subject: string;
  to: string;
}

/**
 * What the sink does with the n-th message (1-based) once its data has arrived: `before` runs
 * before the sink answers, and a false answer refuses the message (451, not delivered);
 * `after` runs right after the sink answered 250.
 */
export interface SinkHooks {
  before?: (n: number) => Promise<boolean> | boolean;
  after?: (n: number) => void;
}

/** A real SMTP server (smtp-server) on 127.0.0.1 that keeps what it accepts. */
export class SmtpSink {
  readonly deliveries: Delivery[] = [];
  /** DATA commands received, accepted or not. */
  received = 0;
  hooks: SinkHooks = {};

  private constructor(
    private readonly server: SMTPServer,
    readonly port: number,
  ) {}

  static async start(port: number): Promise<SmtpSink> {
    let sink: SmtpSink | null = null;
    const server = new SMTPServer({
      disabledCommands: ['STARTTLS', 'AUTH'],
      authOptional: true,
      logger: false,
      onData(stream, _session, callback) {
        const self = sink!;
        const n = ++self.received;
        simpleParser(stream)
          .then(async (mail) => {
            const accept = (await self.hooks.before?.(n)) ?? true;
            if (!accept) {
              callback(Object.assign(new Error('Try again later'), { responseCode: 451 }));
              return;
            }
            const to = mail.to && !Array.isArray(mail.to) ? mail.to.text : '';
            self.deliveries.push({
              messageId: mail.messageId ?? '',
              subject: mail.subject ?? '',
              to,
            });
            callback();
            self.hooks.after?.(n);
          })
          .catch((error: Error) => callback(error));
      },
    });
    await new Promise<void>((resolve, reject) => {
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => resolve());
    });
    const address = server.server.address() as AddressInfo;
    sink = new SmtpSink(server, address.port);
    return sink;
  }

  /** Deliveries per Message-ID. */
  countsById(): Map<string, number> {
    const counts = new Map<string, number>();
    for (const d of this.deliveries) counts.set(d.messageId, (counts.get(d.messageId) ?? 0) + 1);
    return counts;
  }

  close(): Promise<void> {
    return new Promise((resolve) => this.server.close(() => resolve()));
  }
}
