import { vi } from "vitest";

export interface StubRequest {
  method: string;
  path: string;
  headers: Record<string, string>;
  body: unknown;
}

export interface StubReply {
  status?: number;
  body?: unknown;
}

type Handler = StubReply | ((request: StubRequest) => StubReply);

/**
 * Replaces global fetch for one test with answers keyed "METHOD /path". A request with no
 * answer gets a 501 with the error shape, so a missing stub shows up as a visible failure.
 * Returns the requests seen, in order.
 */
export function stubFetch(handlers: Record<string, Handler>): StubRequest[] {
  const calls: StubRequest[] = [];
  vi.stubGlobal("fetch", async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(String(input), "http://plumeline.test");
    const method = (init.method ?? "GET").toUpperCase();
    const headers: Record<string, string> = {};
    new Headers(init.headers).forEach((value, key) => {
      headers[key] = value;
    });
    const request: StubRequest = {
      method,
      path: url.pathname,
      headers,
      body: typeof init.body === "string" ? JSON.parse(init.body) : undefined,
    };
    calls.push(request);
    const handler = handlers[`${method} ${url.pathname}`];
    const reply: StubReply = handler
      ? typeof handler === "function"
        ? handler(request)
        : handler
      : { status: 501, body: { error: { code: "no_stub", message: `No stub for ${method} ${url.pathname}` } } };
    const status = reply.status ?? 200;
    const text = reply.body === undefined ? "" : JSON.stringify(reply.body);
    return new Response(status === 204 ? null : text, { status, headers: { "Content-Type": "application/json" } });
  });
  return calls;
}

/** The error body the API sends (core/contracts/common.ts). */
export function apiError(status: number, code: string, message: string, fields?: Record<string, string>): StubReply {
  return { status, body: { error: { code, message, ...(fields ? { fields } : {}) } } };
}
