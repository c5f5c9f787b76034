import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';

export type CapturedHandler = (raw: Buffer, recipients: string[]) => Promise<void>;

/**
 * An SMTP server on a loopback port that accepts every message and hands it
 * to `onMessage` before answering 250, so a send that resolved is captured.
 */
export class FakeSmtpServer {
  private readonly server: SMTPServer;

  constructor(onMessage: CapturedHandler) {
    this.server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      banner: 'Workback development mail catcher',
      size: 25 * 1024 * 1024,
      onData(stream, session, callback) {
        const chunks: Buffer[] = [];
        stream.on('data', (chunk: Buffer) => chunks.push(chunk));
        stream.on('error', callback);
        stream.on('end', () => {
          const recipients = session.envelope.rcptTo.map((r) => r.address);
          onMessage(Buffer.concat(chunks), recipients).then(
            () => callback(),
            (err: Error) => callback(err),
          );
        });
      },
    });
  }

  /** Listens on 127.0.0.1 and a free port; resolves the port. */
  start(): Promise<number> {
    return new Promise((resolve, reject) => {
      this.server.once('error', reject);
      this.server.listen(0, '127.0.0.1', () => {
        this.server.off('error', reject);
        resolve((this.server.server.address() as AddressInfo).port);
      });
    });
  }

  stop(): Promise<void> {
    return new Promise((resolve) => this.server.close(() => resolve()));
  }
}
