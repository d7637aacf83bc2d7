import { mkdtempSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { portAnswers, startDevMail } from './dev-mail';

/** A port nothing listens on right now. */
function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const server = createServer();
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

describe('development mail inbox', () => {
  it('when it is started, then `ready` settles only once its SMTP port takes connections', async () => {
    const [port, webPort] = [await freePort(), await freePort()];
    expect(await portAnswers(port, 0)).toBe(false);
    const inbox = startDevMail(
      { port, webPort, dataDir: mkdtempSync(path.join(tmpdir(), 'lotwise-devmail-')) },
      () => undefined,
    );
    expect(inbox).not.toBeNull();
    try {
      await inbox!.ready;
      expect(await portAnswers(port, 0)).toBe(true);
    } finally {
      inbox!.stop();
    }
  }, 20_000);
});
