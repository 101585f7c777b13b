import type { Server } from "node:http";

/**
 * How long an idle keep-alive connection stays open. Node's default (5 s) is shorter than the idle
 * timeout of the usual load balancers and proxies (60 s is common), so a proxy can send the next request
 * down a socket Node is closing at that moment and get a reset, which it reports as a 502. The server's
 * idle timeout must outlast the proxy's; the headers timeout must outlast both.
 */
export function applyIdleTimeouts(server: Server, keepAliveMs: number): Server {
  server.keepAliveTimeout = keepAliveMs;
  server.headersTimeout = keepAliveMs + 1_000;
  return server;
}
