/** A signed-in API client over real HTTP (fetch), with the session cookie and CSRF token. */
export interface HttpSession {
  request(method: string, url: string, body?: unknown): Promise<Response>;
  /** Cookie and CSRF headers for a write sent some other way (a slow upload). */
  writeHeaders(): Record<string, string>;
}

export async function signInOverHttp(base: string, email: string, password: string): Promise<HttpSession> {
  let cookie = "";
  let csrf = "";
  const remember = async (res: Response) => {
    const set = res.headers.getSetCookie().find((c) => c.startsWith("plumeline.sid="));
    if (set) cookie = set.split(";")[0];
    if (res.headers.get("content-type")?.includes("json")) {
      const body = await res.clone().json();
      if (typeof body?.csrfToken === "string") csrf = body.csrfToken;
    }
    return res;
  };
  const request = async (method: string, url: string, body?: unknown) =>
    remember(
      await fetch(base + url, {
        method,
        headers: {
          ...(cookie ? { cookie } : {}),
          ...(method === "GET" ? {} : { "x-csrf-token": csrf, "content-type": "application/json" }),
        },
        body: body === undefined ? undefined : JSON.stringify(body),
      }),
    );
  await request("GET", "/api/auth/session");
  let res = await request("POST", "/api/auth/sign-in", { email, password });
  // A server busy hashing other sign-ins answers 503 with Retry-After: wait as asked and try again,
  // as a client should (a crowd signing in at once, e.g. the load benchmark's 200 technicians).
  for (let tries = 0; res.status === 503 && tries < 20; tries++) {
    const waitS = Number(res.headers.get("retry-after") ?? 1);
    await new Promise((r) => setTimeout(r, Math.min(Math.max(waitS, 1), 10) * 1000));
    res = await request("POST", "/api/auth/sign-in", { email, password });
  }
  if (res.status !== 200) throw new Error(`sign-in as ${email} gave ${res.status}: ${await res.text()}`);
  return { request, writeHeaders: () => ({ cookie, "x-csrf-token": csrf, "content-type": "application/json" }) };
}
