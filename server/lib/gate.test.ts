import { describe, expect, it } from "vitest";
import { createGate } from "./gate";

describe("a gate", () => {
  it("lets `concurrency` holders in, queues `queueMax` more in order, and refuses the next at once", async () => {
    const gate = createGate({ concurrency: 1, queueMax: 2 }, () => new Error("full"));
    const order: string[] = [];
    const first = await gate.acquire();
    const second = gate.acquire().then((release) => (order.push("second"), release));
    const third = gate.acquire().then((release) => (order.push("third"), release));
    await expect(gate.acquire()).rejects.toThrow("full");
    expect({ active: gate.active, waiting: gate.waiting }).toEqual({ active: 1, waiting: 2 });
    first();
    first(); // a second release of the same place is ignored
    (await second)();
    (await third)();
    expect(order).toEqual(["second", "third"]);
    expect({ active: gate.active, waiting: gate.waiting }).toEqual({ active: 0, waiting: 0 });
  });

  it("refuses one that has waited maxWaitMs, and hands its turn to the next", async () => {
    const gate = createGate({ concurrency: 1, queueMax: 2, maxWaitMs: 50 }, () => new Error("waited too long"));
    const first = await gate.acquire();
    await expect(gate.acquire()).rejects.toThrow("waited too long");
    expect(gate.waiting).toBe(0);
    const next = gate.acquire();
    first();
    (await next)();
    expect({ active: gate.active, waiting: gate.waiting }).toEqual({ active: 0, waiting: 0 });
  });

  it("frees the place when the work fails", async () => {
    const gate = createGate({ concurrency: 1, queueMax: 0 }, () => new Error("full"));
    await expect(gate.run(async () => Promise.reject(new Error("bad image")))).rejects.toThrow("bad image");
    expect(await gate.run(async () => "next")).toBe("next");
  });
});
