/**
 * Lets the client's own API code (src/lib/api-client.ts, which calls same-origin paths) talk to a real
 * server from Node: relative paths go to `base`, and cookies are kept as a browser would keep them.
 */
export function installBrowserFetch(base: string): () => void {
  const realFetch = globalThis.fetch;
  const jar = new Map<string, string>();
  globalThis.fetch = async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(typeof input === "string" || input instanceof URL ? input : input.url, base);
    const headers = new Headers(init.headers);
    if (jar.size) headers.set("Cookie", [...jar].map(([k, v]) => `${k}=${v}`).join("; "));
    const response = await realFetch(url, { ...init, headers });
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair.indexOf("=");
      jar.set(pair.slice(0, eq).trim(), pair.slice(eq + 1).trim());
    }
    return response;
  };
  return () => {
    globalThis.fetch = realFetch;
  };
}
