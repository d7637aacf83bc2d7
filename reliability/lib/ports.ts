import { createServer } from 'node:net';

/** The loopback ports the suite may use (servers it starts, SMTP sinks). */
export const portRange = {
  first: Number(process.env.RELIABILITY_PORT_FIRST ?? 4500),
  last: Number(process.env.RELIABILITY_PORT_LAST ?? 4599),
};

const handedOut = new Set<number>();

function listenable(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = createServer();
    probe.once('error', () => resolve(false));
    probe.listen(port, '127.0.0.1', () => probe.close(() => resolve(true)));
  });
}

/**
 * A port of the range nobody listens on now and this process has not handed out before, so a
 * server that is stopped keeps its port for its restart.
 */
export async function freePort(): Promise<number> {
  for (let port = portRange.first; port <= portRange.last; port++) {
    if (handedOut.has(port)) continue;
    if (await listenable(port)) {
      handedOut.add(port);
      return port;
    }
  }
  throw new Error(
    `No free port in ${portRange.first}-${portRange.last} (set RELIABILITY_PORT_FIRST/LAST)`,
  );
}
