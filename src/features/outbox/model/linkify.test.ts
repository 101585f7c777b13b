import { describe, expect, it } from "vitest";
import { linkify } from "./linkify";

describe("linkify", () => {
  it("splits text around an http link and leaves sentence punctuation outside it", () => {
    expect(linkify("Join here: http://127.0.0.1:5180/invite/abc123. Thanks")).toEqual([
      { kind: "text", text: "Join here: " },
      { kind: "link", href: "http://127.0.0.1:5180/invite/abc123" },
      { kind: "text", text: ". Thanks" },
    ]);
  });

  it("finds several links, including https with a query", () => {
    const parts = linkify("A https://a.example/x?y=1&z=2\nB http://b.example/reset-password/t0k3n");
    expect(parts.filter((p) => p.kind === "link").map((p) => (p.kind === "link" ? p.href : ""))).toEqual([
      "https://a.example/x?y=1&z=2",
      "http://b.example/reset-password/t0k3n",
    ]);
  });

  it("never makes a link of other schemes", () => {
    expect(linkify("javascript:alert(1) data:text/html,x")).toEqual([
      { kind: "text", text: "javascript:alert(1) data:text/html,x" },
    ]);
  });

  it("keeps the whole text when it has no links", () => {
    expect(linkify("")).toEqual([]);
    expect(linkify("Plain words.")).toEqual([{ kind: "text", text: "Plain words." }]);
  });
});
