import { randomInt } from "node:crypto";
import { baseUrl } from "./loopback";

/**
 * A tiny HTTP client with its own cookie jar and its own client address (sent as
 * X-Forwarded-For; the test server trusts loopback as its proxy), so tests never share
 * rate-limit counters. `baseUrl` reaches the server another way (e.g. a non-loopback address).
 */
export class TestClient {
  readonly cookies = new Map<string, string>();
  readonly address = `10.${randomInt(256)}.${randomInt(256)}.${randomInt(1, 255)}`;
  readonly baseUrl: string;

  constructor(options: { baseUrl?: string } = {}) {
    this.baseUrl = options.baseUrl ?? baseUrl;
  }

  private cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  private keepCookies(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair.indexOf("=");
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      if (/max-age=0|expires=thu, 01 jan 1970/i.test(line) || value === "") this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async request(
    path: string,
    init: { method?: string; json?: unknown; raw?: { body: string; contentType: string }; form?: Record<string, string>; multipart?: FormData; origin?: string | null; headers?: Record<string, string> } = {},
  ): Promise<Response> {
    const method = init.method ?? (init.json !== undefined || init.raw || init.form || init.multipart ? "POST" : "GET");
    const headers: Record<string, string> = { "x-forwarded-for": this.address, ...init.headers };
    if (this.cookies.size) headers.cookie = this.cookieHeader();
    if (method !== "GET" && init.origin !== null) headers.origin = init.origin ?? new URL(this.baseUrl).origin;
    let body: string | FormData | undefined;
    if (init.multipart) {
      body = init.multipart;
    } else if (init.raw) {
      headers["content-type"] = init.raw.contentType;
      body = init.raw.body;
    } else if (init.json !== undefined) {
      headers["content-type"] = "application/json";
      body = JSON.stringify(init.json);
    } else if (init.form) {
      headers["content-type"] = "application/x-www-form-urlencoded";
      body = new URLSearchParams(init.form).toString();
    }
    const response = await fetch(`${this.baseUrl}${path}`, { method, headers, body, redirect: "manual" });
    this.keepCookies(response);
    return response;
  }

  /** Signs in through next-auth's credentials callback, as the sign-in form does. */
  async signIn(email: string, password: string): Promise<{ ok: boolean; error: string | null }> {
    const csrf = await this.request("/api/auth/csrf");
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const response = await this.request("/api/auth/callback/credentials", {
      form: { csrfToken, email, password, json: "true", callbackUrl: `${this.baseUrl}/devices` },
    });
    const location = response.headers.get("location") ?? "";
    let url = location;
    if (!url && response.headers.get("content-type")?.includes("json")) url = ((await response.json()) as { url?: string }).url ?? "";
    const error = url ? new URL(url, this.baseUrl).searchParams.get("error") : null;
    const ok = !error && [...this.cookies.keys()].some((k) => k.endsWith("next-auth.session-token"));
    return { ok, error };
  }
}
