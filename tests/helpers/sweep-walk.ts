/**
 * Readings for API tests, made by a model unlike the locator's kernel: exponential decay with the
 * straight-line distance from a leak, seen by a detector that samples the air one delay plus one time
 * constant back along the walk. The walk goes east along a case front, back along the aisle and east
 * behind the case; a tap every 1.3 m, 1.6 s apart.
 */
export function caseWalkReadings(
  startedAt: Date,
  leak = { x: 12, y: 3 },
  peakPpm = 90,
  lagS = 6.5,
): Record<string, unknown>[] {
  const legs: [number, number][] = [
    [1, 3.9],
    [22, 3.9],
    [22, 5.2],
    [1, 5.2],
    [1, 1.2],
    [22, 1.2],
  ];
  const taps: { x: number; y: number; s: number }[] = [];
  let s = 10;
  for (let k = 1; k < legs.length; k++) {
    const [ax, ay] = legs[k - 1];
    const [bx, by] = legs[k];
    const len = Math.hypot(bx - ax, by - ay);
    for (let d = 0; d < len; d += 1.3) {
      taps.push({ x: ax + ((bx - ax) * d) / len, y: ay + ((by - ay) * d) / len, s });
      s += 1.6;
    }
  }
  const conc = (x: number, y: number) => 0.4 + peakPpm * Math.exp(-Math.hypot(x - leak.x, y - leak.y) / 1.2);
  return taps.map((tap) => {
    const back = tap.s - lagS;
    let x = taps[0].x,
      y = taps[0].y;
    for (let k = 1; k < taps.length; k++) {
      if (taps[k].s >= back && taps[k - 1].s <= back) {
        const f = (back - taps[k - 1].s) / (taps[k].s - taps[k - 1].s);
        x = taps[k - 1].x + f * (taps[k].x - taps[k - 1].x);
        y = taps[k - 1].y + f * (taps[k].y - taps[k - 1].y);
      }
    }
    return {
      id: crypto.randomUUID(),
      x: Number(tap.x.toFixed(3)),
      y: Number(tap.y.toFixed(3)),
      takenAt: new Date(startedAt.getTime() + tap.s * 1000).toISOString(),
      ppm: Math.round(conc(x, y)),
      samplePoint: "grille",
    };
  });
}

/** The case line those readings walk: a 21 m open case, y 2..3.6, with a line-set drop behind it. */
export function caseLineFixtures(caseId: string, dropId: string) {
  return [
    {
      id: caseId,
      kind: "open-case",
      label: "Dairy 1–4",
      systemId: null,
      hasFans: true,
      polygon: [
        [1, 2],
        [22, 2],
        [22, 3.6],
        [1, 3.6],
      ],
    },
    { id: dropId, kind: "line-set-drop", label: "Drop D2", systemId: null, hasFans: false, point: { x: 12, y: 2.2 } },
  ];
}
