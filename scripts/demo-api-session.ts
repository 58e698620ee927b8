/**
 * One signed-in person of the demo talking JSON to a running Benchfold, the way the workspace's
 * own pages do (session cookie, same Origin). Used by the demo loader's review and release story.
 */
import { signInOverHttp } from "./sign-in-over-http";

export class DemoApiSession {
  private constructor(
    readonly appUrl: string,
    readonly email: string,
    private readonly cookie: string,
  ) {}

  static async signIn(appUrl: string, credentials: { email: string; password: string }): Promise<DemoApiSession> {
    return new DemoApiSession(appUrl, credentials.email, await signInOverHttp(appUrl, credentials));
  }

  /** The status and parsed body of one request; no check. */
  async send<T>(method: "GET" | "POST" | "PUT" | "DELETE", path: string, body?: unknown): Promise<{ status: number; body: T }> {
    const r = await fetch(`${this.appUrl}${path}`, {
      method,
      headers: { cookie: this.cookie, origin: new URL(this.appUrl).origin, ...(body === undefined ? {} : { "content-type": "application/json" }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await r.text();
    return { status: r.status, body: (text ? JSON.parse(text) : null) as T };
  }

  /** The parsed body when the answer has the expected status; otherwise an error naming the request, the person and the server's message. */
  async call<T>(method: "GET" | "POST" | "PUT" | "DELETE", path: string, body?: unknown, expected = method === "POST" ? 201 : 200): Promise<T> {
    const answer = await this.send<T & { error?: { message?: string } }>(method, path, body);
    if (answer.status !== expected) {
      throw new Error(`${method} ${path} as ${this.email}: ${answer.status} ${answer.body?.error?.message ?? JSON.stringify(answer.body)}`);
    }
    return answer.body;
  }
}
