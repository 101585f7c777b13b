import { beforeEach, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { sessionInfo } from "#core/contracts/auth";
import { apiError, stubFetch } from "../../tests/helpers/stub-fetch";
import { sessionFor, signedOutSession } from "../../tests/helpers/session-fixtures";
import { api, ApiRequestError, currentCsrfToken, setCsrfToken } from "./api-client";

const ok = z.object({ ok: z.literal(true) });

beforeEach(() => setCsrfToken(null));

describe("api client", () => {
  it("sends the CSRF token of the latest SessionInfo on state-changing requests only", async () => {
    const calls = stubFetch({
      "GET /api/auth/session": { body: signedOutSession("token-from-session") },
      "POST /api/auth/password-reset": { status: 202, body: { ok: true } },
      "GET /api/health": { body: { ok: true } },
    });
    await api.get("/api/auth/session", sessionInfo);
    await api.post("/api/auth/password-reset", ok, { email: "a@b.example" });
    await api.get("/api/health", ok);

    expect(calls[1]!.headers["x-csrf-token"]).toBe("token-from-session");
    expect(calls[1]!.headers["content-type"]).toBe("application/json");
    expect(calls[1]!.body).toEqual({ email: "a@b.example" });
    expect(calls[0]!.headers["x-csrf-token"]).toBeUndefined();
    expect(calls[2]!.headers["x-csrf-token"]).toBeUndefined();
  });

  it("replaces the token whenever a SessionInfo comes back (sign-in rotates it)", async () => {
    const calls = stubFetch({
      "GET /api/auth/session": { body: signedOutSession("before-sign-in") },
      "POST /api/auth/sign-in": { body: sessionFor("owner", { csrfToken: "after-sign-in" }) },
      "DELETE /api/team/invitations/abc": { status: 204 },
    });
    await api.get("/api/auth/session", sessionInfo);
    await api.post("/api/auth/sign-in", sessionInfo, { email: "x@y.example", password: "p" });
    expect(currentCsrfToken()).toBe("after-sign-in");
    await api.delete("/api/team/invitations/abc");

    expect(calls[1]!.headers["x-csrf-token"]).toBe("before-sign-in");
    expect(calls[2]!.headers["x-csrf-token"]).toBe("after-sign-in");
  });

  it("reads the session first when a page posts before any token is known", async () => {
    const calls = stubFetch({
      "GET /api/auth/session": { body: signedOutSession("fresh-token") },
      "POST /api/auth/password-reset": { status: 202, body: { ok: true } },
    });
    await api.post("/api/auth/password-reset", ok, { email: "a@b.example" });
    expect(calls.map((c) => `${c.method} ${c.path}`)).toEqual([
      "GET /api/auth/session",
      "POST /api/auth/password-reset",
    ]);
    expect(calls[1]!.headers["x-csrf-token"]).toBe("fresh-token");
  });

  it("sends cookies same-origin", async () => {
    const fetchSpy = vi.fn(async () => new Response(JSON.stringify({ ok: true }), { status: 200 }));
    vi.stubGlobal("fetch", fetchSpy);
    await api.get("/api/health", ok);
    expect(fetchSpy).toHaveBeenCalledWith(
      "/api/health",
      expect.objectContaining({ credentials: "same-origin", method: "GET" }),
    );
  });

  it("parses the error shape into an ApiRequestError with status, code, message and fields", async () => {
    stubFetch({
      "POST /api/team/invitations": apiError(400, "validation_failed", "Some fields need attention.", {
        email: "must be a valid e-mail address",
        storeIds: "a store contact must be given at least one store",
      }),
    });
    const error = await api.post("/api/team/invitations", ok, { email: "nope" }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiRequestError);
    expect(error).toMatchObject({
      status: 400,
      code: "validation_failed",
      message: "Some fields need attention.",
      fields: { email: "must be a valid e-mail address", storeIds: "a store contact must be given at least one store" },
    });
  });

  it("gives an error without fields an empty fields map", async () => {
    stubFetch({
      "POST /api/auth/sign-in": apiError(429, "rate_limited", "Too many sign-in attempts. Try again in 15 minutes."),
    });
    const error = (await api.post("/api/auth/sign-in", sessionInfo, {}).catch((e: unknown) => e)) as ApiRequestError;
    expect(error.status).toBe(429);
    expect(error.code).toBe("rate_limited");
    expect(error.message).toBe("Too many sign-in attempts. Try again in 15 minutes.");
    expect(error.fields).toEqual({});
  });

  it("turns a non-JSON failure (a proxy's HTML page) into an internal error without its body", async () => {
    vi.stubGlobal("fetch", async () => new Response("<html>Bad gateway at line 42</html>", { status: 502 }));
    const error = (await api.get("/api/health", ok).catch((e: unknown) => e)) as ApiRequestError;
    expect(error.code).toBe("internal");
    expect(error.status).toBe(502);
    expect(error.message).not.toContain("line 42");
  });

  it("reports an unreachable server as a network error", async () => {
    vi.stubGlobal("fetch", async () => {
      throw new TypeError("Failed to fetch");
    });
    const error = (await api.get("/api/health", ok).catch((e: unknown) => e)) as ApiRequestError;
    expect(error.code).toBe("network");
    expect(error.status).toBe(0);
  });

  it("refuses an answer that does not match the contract", async () => {
    stubFetch({ "GET /api/auth/session": { body: { user: "not an object" } } });
    const error = (await api.get("/api/auth/session", sessionInfo).catch((e: unknown) => e)) as ApiRequestError;
    expect(error.code).toBe("unexpected_response");
  });
});
