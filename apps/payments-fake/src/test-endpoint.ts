import { createServer, type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';

export interface ReceivedWebhook {
  body: string;
  headers: IncomingHttpHeaders;
  at: number;
}

/**
 * A webhook endpoint for tests: keeps every raw body it receives and answers 200, or 500 for
 * the next `failNext` requests.
 */
export async function startTestEndpoint() {
  const received: ReceivedWebhook[] = [];
  let failing = 0;
  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      received.push({
        body: Buffer.concat(chunks).toString('utf8'),
        headers: req.headers,
        at: Date.now(),
      });
      if (failing > 0) {
        failing--;
        res.writeHead(500).end('not now');
      } else {
        res.writeHead(200).end('ok');
      }
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}/hook`,
    received,
    failNext(count: number) {
      failing = count;
    },
    ofType(type: string) {
      return received.filter((hook) => (JSON.parse(hook.body) as { type: string }).type === type);
    },
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
