import type { AddressInfo } from "node:net";
import type { Server } from "node:http";
import type { Server as SocketServer } from "socket.io";
import type { AppOptions } from "../../server/app";
import { createHttpServer } from "../../server/http-server";

export type TestApp = { baseUrl: string; server: Server; io: SocketServer; close: () => Promise<void> };

/** Starts the real Express app, with socket.io, on an ephemeral loopback port. */
export async function startTestApp(options: AppOptions = {}): Promise<TestApp> {
  const { server, io } = createHttpServer({ serveClient: false, ...options });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    server,
    io,
    close: () =>
      new Promise((resolve) => {
        io.close();
        server.close(() => resolve());
      }),
  };
}

/** A small HTTP client that keeps cookies between requests, as a browser would. */
export class HttpAgent {
  private cookies = new Map<string, string>();
  constructor(private readonly baseUrl: string) {}

  async request(method: string, path: string, body?: unknown, headers: Record<string, string> = {}) {
    const response = await fetch(`${this.baseUrl}${path}`, {
      method,
      headers: {
        ...(body === undefined || body instanceof FormData ? {} : { "content-type": "application/json" }),
        ...(this.cookies.size ? { cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ") } : {}),
        origin: this.baseUrl,
        ...headers,
      },
      body: body === undefined ? undefined : typeof body === "string" || body instanceof FormData ? body : JSON.stringify(body),
    });
    for (const cookie of response.headers.getSetCookie()) {
      const [pair] = cookie.split(";");
      const index = pair.indexOf("=");
      const name = pair.slice(0, index);
      const value = pair.slice(index + 1);
      if (value === "" || /max-age=0/i.test(cookie)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    const bytes = Buffer.from(await response.arrayBuffer());
    const text = bytes.toString("utf8");
    // eslint-disable-next-line @typescript-eslint/no-explicit-any -- a test reads any answer shape, as the routes send it
    let json: any = undefined;
    try {
      json = text ? JSON.parse(text) : undefined;
    } catch {
      json = undefined;
    }
    return { status: response.status, body: json, text, bytes, headers: response.headers };
  }

  get(path: string) {
    return this.request("GET", path);
  }
  post(path: string, body: unknown = {}) {
    return this.request("POST", path, body);
  }
  patch(path: string, body: unknown) {
    return this.request("PATCH", path, body);
  }
  put(path: string, body: unknown) {
    return this.request("PUT", path, body);
  }
  delete(path: string) {
    return this.request("DELETE", path);
  }
  /** A multipart/form-data POST (file uploads); fetch writes the boundary header itself. */
  postForm(path: string, form: FormData) {
    return this.request("POST", path, form);
  }

  async signIn(email: string, password: string) {
    const response = await this.post("/api/auth/sign-in/email", { email, password });
    if (response.status !== 200) throw new Error(`sign-in failed for ${email}: ${response.status} ${response.text}`);
    return response;
  }
}

/** A unique e-mail address on the reserved .test domain (RFC 2606). */
export function uniqueEmail(prefix: string) {
  return `${prefix}-${crypto.randomUUID().slice(0, 8)}@outroll-tests.test`;
}
