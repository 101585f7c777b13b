import type { z } from "zod";
import { apiErrorSchema } from "#core/contracts/common";

/** A failed API call, carrying the server's one error shape (core/contracts/common.ts). */
export class ApiRequestError extends Error {
  readonly status: number;
  readonly code: string;
  /** Dotted field path → message, from the server's zod validation. */
  readonly fields: Record<string, string>;

  constructor(status: number, code: string, message: string, fields: Record<string, string> = {}) {
    super(message);
    this.name = "ApiRequestError";
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiRequestError(error: unknown): error is ApiRequestError {
  return error instanceof ApiRequestError;
}

// The CSRF token comes from the latest SessionInfo the server sent; it changes at sign-in,
// sign-out and company switch, so every response that carries one replaces it.
let csrfToken: string | null = null;

export function setCsrfToken(token: string | null): void {
  csrfToken = token;
}

export function currentCsrfToken(): string | null {
  return csrfToken;
}

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

const SESSION_PATH = "/api/auth/session";

// Reading the session may create one (it carries the CSRF token), and its response sets the session
// cookie. A read still in flight when sign-in rotates the session id would land after it and put the
// old, signed-out cookie back. So session reads and writes that change the session never overlap:
// each waits for the other kind to finish first.
const sessionReads = new Set<Promise<unknown>>();
const sessionWrites = new Set<Promise<unknown>>();
const CHANGES_SESSION = /^\/api\/(auth\/|invitations\/[^/]+\/accept$)/;

async function settled(set: Set<Promise<unknown>>): Promise<void> {
  await Promise.allSettled([...set]);
}

function track<T>(set: Set<Promise<unknown>>, promise: Promise<T>): Promise<T> {
  set.add(promise);
  const done = () => set.delete(promise);
  promise.then(done, done);
  return promise;
}

/**
 * A page opened straight from an e-mail link (invitation, password reset) may post before
 * anything has read the session; read it first so the request carries a token.
 */
export async function ensureCsrfToken(): Promise<void> {
  if (csrfToken) return;
  try {
    await settled(sessionWrites);
    const response = await track(
      sessionReads,
      fetch(SESSION_PATH, { headers: { Accept: "application/json" }, credentials: "same-origin" }),
    );
    if (response.ok) rememberCsrf(await readJson(response));
  } catch {
    // the real request below reports the network problem
  }
}

export interface RequestOptions {
  /** JSON-encoded, unless it is FormData (a file upload), which the browser encodes itself. */
  body?: unknown;
  signal?: AbortSignal;
}

async function readJson(response: Response): Promise<unknown> {
  if (response.status === 204) return null;
  const text = await response.text();
  if (text === "") return null;
  try {
    return JSON.parse(text);
  } catch {
    return undefined; // not JSON (a proxy's HTML error page, for instance)
  }
}

function rememberCsrf(body: unknown): void {
  if (body && typeof body === "object" && "csrfToken" in body) {
    const token = (body as { csrfToken: unknown }).csrfToken;
    if (typeof token === "string") csrfToken = token;
  }
}

export function toError(status: number, body: unknown): ApiRequestError {
  const parsed = apiErrorSchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiRequestError(status, code, message, fields ?? {});
  }
  return new ApiRequestError(
    status,
    status >= 500 ? "internal" : "unexpected_response",
    status >= 500
      ? "The server ran into a problem. Please try again in a moment."
      : `The server answered with an unexpected response (HTTP ${status}).`,
  );
}

/**
 * Calls the same-origin API with the session cookie and, on state-changing requests, the CSRF
 * header. Responses are checked against `schema` so a contract drift fails loudly here, not
 * deep in a component.
 */
export async function apiRequest<T>(
  method: Method,
  path: string,
  schema: z.ZodType<T> | null,
  options: RequestOptions = {},
): Promise<T> {
  if (method !== "GET") await ensureCsrfToken();
  try {
    return await send(method, path, schema, options);
  } catch (error) {
    // The token can go stale (another tab signed out and in): read a fresh one and try once more.
    if (method !== "GET" && isApiRequestError(error) && error.code === "csrf_failed") {
      csrfToken = null;
      await ensureCsrfToken();
      return send(method, path, schema, options);
    }
    throw error;
  }
}

async function send<T>(method: Method, path: string, schema: z.ZodType<T> | null, options: RequestOptions): Promise<T> {
  const headers: Record<string, string> = { Accept: "application/json" };
  const isForm = typeof FormData !== "undefined" && options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers["Content-Type"] = "application/json";
  if (method !== "GET" && csrfToken) headers["X-CSRF-Token"] = csrfToken;

  const isSessionRead = method === "GET" && path === SESSION_PATH;
  const changesSession = method !== "GET" && CHANGES_SESSION.test(path);
  if (isSessionRead) await settled(sessionWrites);
  if (changesSession) await settled(sessionReads);

  let response: Response;
  try {
    const request = fetch(path, {
      method,
      headers,
      credentials: "same-origin",
      body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
      signal: options.signal,
    });
    response = await (isSessionRead
      ? track(sessionReads, request)
      : changesSession
        ? track(sessionWrites, request)
        : request);
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === "AbortError") throw cause;
    throw new ApiRequestError(
      0,
      "network",
      "Plumeline could not reach the server. Check the connection and try again.",
    );
  }

  const body = await readJson(response);
  if (!response.ok) throw toError(response.status, body);
  rememberCsrf(body);
  if (schema === null) return undefined as T;
  const parsed = schema.safeParse(body);
  if (!parsed.success) {
    throw new ApiRequestError(
      response.status,
      "unexpected_response",
      `The server's answer to ${method} ${path} did not match the contract.`,
    );
  }
  return parsed.data;
}

export const api = {
  get: <T>(path: string, schema: z.ZodType<T>, signal?: AbortSignal) => apiRequest("GET", path, schema, { signal }),
  post: <T>(path: string, schema: z.ZodType<T> | null, body?: unknown) =>
    apiRequest("POST", path, schema, { body: body ?? {} }),
  put: <T>(path: string, schema: z.ZodType<T> | null, body: unknown) => apiRequest("PUT", path, schema, { body }),
  patch: <T>(path: string, schema: z.ZodType<T> | null, body: unknown) => apiRequest("PATCH", path, schema, { body }),
  delete: (path: string) => apiRequest<void>("DELETE", path, null),
  /** A DELETE whose answer says what happened (e.g. a system with records is retired, not deleted). */
  deleteWithAnswer: <T>(path: string, schema: z.ZodType<T>) => apiRequest("DELETE", path, schema),
  /** A multipart upload (multer on the server reads the named file field). */
  upload: <T>(path: string, schema: z.ZodType<T>, form: FormData) => apiRequest("POST", path, schema, { body: form }),
};

/** A multipart upload (a photo, a plan image): same cookie, CSRF header and error shape as api.post. */
export async function apiUpload<T>(path: string, form: FormData, schema: z.ZodType<T>): Promise<T> {
  await ensureCsrfToken();
  let response: Response;
  try {
    response = await fetch(path, {
      method: "POST",
      headers: { Accept: "application/json", ...(csrfToken ? { "X-CSRF-Token": csrfToken } : {}) },
      credentials: "same-origin",
      body: form,
    });
  } catch {
    throw new ApiRequestError(
      0,
      "network",
      "Plumeline could not reach the server. Check the connection and try again.",
    );
  }
  const body = await readJson(response);
  if (!response.ok) throw toError(response.status, body);
  const parsed = schema.safeParse(body);
  if (!parsed.success)
    throw new ApiRequestError(
      response.status,
      "unexpected_response",
      `The server's answer to POST ${path} did not match the contract.`,
    );
  return parsed.data;
}
