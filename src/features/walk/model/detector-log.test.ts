import { describe, expect, it } from "vitest";
import { alignLog, readLogSamples, readLogTable, type TapPosition } from "./detector-log";

const start = Date.parse("2026-11-02T14:00:00Z");
const taps: TapPosition[] = [
  { x: 0, y: 1, takenAtMs: start, samplePoint: "grille" },
  { x: 4, y: 1, takenAtMs: start + 8000, samplePoint: "grille" },
  { x: 4, y: 5, takenAtMs: start + 16000, samplePoint: "return" },
];

describe("a detector's CSV log", () => {
  const csv = [
    "Elapsed (s),Gas,Unit",
    "0,0.0,ppm",
    "4,1.5,ppm",
    "",
    "x,2,ppm",
    "12,-1,ppm",
    "13,,ppm",
    "14,>1000,ppm",
    "15,20000,ppm",
    "30,3,ppm",
  ].join("\r\n");

  it("reports each bad row by line number and reason and keeps the good ones", () => {
    const table = readLogTable(csv);
    expect(table.headers).toEqual(["Elapsed (s)", "Gas", "Unit"]);
    const { samples, bad } = readLogSamples(table, 0, 1, start);
    expect(samples.map((s) => s.line)).toEqual([2, 3, 8, 10]);
    expect(samples[2]).toMatchObject({ ppm: 1000, atLeast: true });
    expect(bad).toEqual([
      { line: 5, reason: 'Elapsed (s) "x" is not a time' },
      { line: 6, reason: "Gas -1 is below 0 ppm" },
      { line: 7, reason: "Gas is empty" },
      { line: 9, reason: "Gas 20000 is above the 10,000 ppm instrument ceiling" },
    ]);
  });

  it("places samples on the tapped path by time, with the clock offset, and reports those outside it", () => {
    const { samples } = readLogSamples(readLogTable(csv), 0, 1, start);
    const { placed, bad } = alignLog(samples, taps, 0);
    // 4 s: half way from (0,1) at 0 s to (4,1) at 8 s; 14 s: three quarters up the second leg
    expect(placed.map((p) => [p.line, p.x, p.y])).toEqual([
      [2, 0, 1],
      [3, 2, 1],
      [8, 4, 4],
    ]);
    expect(placed[2].samplePoint).toBe("return");
    expect(bad).toEqual([{ line: 10, reason: "at this clock offset its time falls after the last tapped position" }]);
    // a detector clock 2 s behind: +2 s moves every sample forward along the path
    expect(alignLog(samples, taps, 2).placed[1].x).toBe(3);
  });

  it("reads ISO and time-of-day columns", () => {
    const iso = readLogSamples(
      readLogTable("time,ppm\n2026-11-02T14:00:06Z,0.4\n2026-11-02 14:00:06Z,0.5"),
      0,
      1,
      start,
    );
    expect(iso.samples.map((s) => s.timeMs)).toEqual([start + 6000, start + 6000]);
    const local = new Date(start);
    const tod = `${local.getHours()}:${String(local.getMinutes()).padStart(2, "0")}:07`;
    expect(readLogSamples(readLogTable(`time,ppm\n${tod},0`), 0, 1, start).samples[0].timeMs).toBe(start + 7000);
    expect(readLogSamples(readLogTable("time,ppm\n25:61:00,0"), 0, 1, start).bad[0].line).toBe(2);
  });
});
