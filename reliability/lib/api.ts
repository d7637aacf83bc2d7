/** The password of the demo accounts a fresh development database is seeded with. */
export const demoPassword = 'lotwise-demo-2026';

/** Demo accounts by role (seeded on a fresh development database). */
export const demoUsers = {
  admin: 'instructor@example.test',
  manager: 'technician@example.test',
  members: ['member.one@example.test', 'member.two@example.test', 'member.three@example.test'],
} as const;

/** One answer: status 0 when no HTTP answer came (connection refused or reset). */
export interface Answer<T = unknown> {
  status: number;
  body: T;
  ms: number;
  /** The network error when no answer came. */
  error?: string;
}

/** A signed-in person talking to the API over HTTP, as the web app does (cookie + Origin). */
export class ApiClient {
  private cookie = '';

  constructor(readonly origin: string) {}

  static async signIn(origin: string, email: string, password = demoPassword) {
    const client = new ApiClient(origin);
    await client.signIn(email, password);
    return client;
  }

  /** The same session (its cookie) sent to another server, e.g. a second app instance. */
  at(origin: string): ApiClient {
    const other = new ApiClient(origin);
    other.cookie = this.cookie;
    return other;
  }

  async signIn(email: string, password = demoPassword): Promise<void> {
    const response = await fetch(`${this.origin}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: this.origin },
      body: JSON.stringify({ email, password }),
    });
    if (!response.ok) {
      throw new Error(`Sign-in of ${email} answered ${response.status}: ${await response.text()}`);
    }
    this.cookie = response.headers
      .getSetCookie()
      .map((line) => line.split(';')[0]!)
      .join('; ');
  }

  /** Sends one request; never throws for a status or a network failure (status 0). */
  async send<T = unknown>(method: string, path: string, body?: unknown): Promise<Answer<T>> {
    const started = performance.now();
    const form = body instanceof FormData;
    try {
      const response = await fetch(`${this.origin}${path}`, {
        method,
        headers: {
          cookie: this.cookie,
          origin: this.origin,
          ...(body === undefined || form ? {} : { 'content-type': 'application/json' }),
        },
        body: body === undefined ? undefined : form ? body : JSON.stringify(body),
      });
      const text = await response.text();
      let parsed: unknown = text;
      try {
        parsed = text ? JSON.parse(text) : null;
      } catch {
        // not JSON: keep the text
      }
      return { status: response.status, body: parsed as T, ms: performance.now() - started };
    } catch (error) {
      const cause = (error as { cause?: { code?: string; message?: string } }).cause;
      return {
        status: 0,
        body: null as T,
        ms: performance.now() - started,
        error: cause?.code ?? cause?.message ?? String(error),
      };
    }
  }

  /** Sends one request and answers its body; throws unless the answer is 2xx. */
  async json<T>(method: string, path: string, body?: unknown): Promise<T> {
    const answer = await this.send<T>(method, path, body);
    if (answer.status < 200 || answer.status >= 300) {
      throw new Error(
        `${method} ${path} answered ${answer.status || answer.error}: ${JSON.stringify(answer.body).slice(0, 600)}`,
      );
    }
    return answer.body;
  }
}

/** The app's own ledger check (GET /api/maintenance/ledger-check, admin). */
export interface LedgerCheck {
  ok: boolean;
  containersChecked: number;
  entriesChecked: number;
  problems: { labelCode: string; kind: string; message: string }[];
}

export function ledgerCheck(admin: ApiClient): Promise<LedgerCheck> {
  return admin.json<LedgerCheck>('GET', '/api/maintenance/ledger-check');
}
