import net from "node:net";
import http from "node:http";
import type { AddressInfo } from "node:net";
import { describe, expect, it } from "vitest";
import { readEnv } from "../env";
import { applyIdleTimeouts } from "./idle-timeouts";

// Node closes an idle keep-alive socket about 6 s after its answer with the defaults
// (server.keepAliveTimeout 5,000 ms, nodejs.org/api/http.html, plus Node's own 1 s margin): idle 7 s.
const IDLE_MS = 7_000;

/** Two GETs on one raw socket, IDLE_MS apart; resolves with what the second one got back. */
async function secondRequestAfterIdle(server: http.Server): Promise<string> {
  const { port } = server.address() as AddressInfo;
  const socket = net.connect(port, "127.0.0.1");
  let received = "";
  socket.on("data", (d) => (received += d));
  const closed = new Promise<void>((r) => socket.on("close", () => r()));
  const request = "GET / HTTP/1.1\r\nHost: 127.0.0.1\r\nConnection: keep-alive\r\n\r\n";
  socket.write(request);
  while (!received.includes("\r\n\r\nok")) await new Promise((r) => setTimeout(r, 20));
  received = "";
  await new Promise((r) => setTimeout(r, IDLE_MS));
  if (!socket.destroyed && socket.writable) socket.write(request);
  await Promise.race([closed, new Promise((r) => setTimeout(r, 1_000))]);
  socket.destroy();
  return received;
}

async function withServer<T>(configure: (s: http.Server) => void, use: (s: http.Server) => Promise<T>): Promise<T> {
  const server = http.createServer((_req, res) => res.end("ok"));
  configure(server);
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
  try {
    return await use(server);
  } finally {
    server.closeAllConnections();
    await new Promise<void>((r) => server.close(() => r()));
  }
}

describe.concurrent("idle keep-alive connections", () => {
  it("stay open past Node's default with the configured timeout, so a proxy reusing one gets an answer", async () => {
    const env = readEnv({ DATABASE_URL: "postgres://x@127.0.0.1:1/x", NODE_ENV: "test" });
    expect(env.KEEP_ALIVE_TIMEOUT_MS).toBeGreaterThan(60_000);
    const answer = await withServer((s) => applyIdleTimeouts(s, env.KEEP_ALIVE_TIMEOUT_MS), secondRequestAfterIdle);
    expect(answer).toContain("\r\n\r\nok");
  }, 20_000);

  it("are closed by Node's defaults within the same idle time (the failure the setting prevents)", async () => {
    expect(await withServer(() => {}, secondRequestAfterIdle)).toBe("");
  }, 20_000);

  it("have a headers timeout that outlasts the idle timeout", async () => {
    const server = applyIdleTimeouts(http.createServer(), 70_000);
    expect(server.headersTimeout).toBeGreaterThan(server.keepAliveTimeout);
  });
});
