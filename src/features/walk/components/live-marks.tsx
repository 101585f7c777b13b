import { Circle, Rect, Text } from "react-konva";
import type { LiveProbe, LiveSuspect } from "#core/analysis/guide/live-guide";
import { markLooks } from "../model/plan-marks";

/**
 * The live estimate on the Walk plan: each suspect as a dashed circle of its radius with its rank, each
 * next probe point as a numbered square in walking order. Drawn in plan metres; sizes on screen are
 * divided by the zoom so they stay the same at every zoom.
 */
export function LiveMarks({
  suspects,
  probes,
  zoom,
  highContrast,
}: {
  suspects: readonly LiveSuspect[];
  probes: readonly LiveProbe[];
  zoom: number;
  highContrast: boolean;
}) {
  const look = markLooks(highContrast);
  const px = (n: number) => n / zoom;
  // A probe square is 0.5 m across, kept between 10 and 22 px: probe points 0.6 m apart stay apart at
  // the whole-store view. Its number shows once the square is big enough to read it.
  const side = Math.min(22, Math.max(10, 0.5 * zoom));
  const numbered = side >= 18;
  return (
    <>
      {suspects.map((s) => (
        <Circle
          key={`s${s.rank}`}
          x={s.x}
          y={s.y}
          radius={s.radius}
          fill={look.liveSuspect.fill}
          stroke={look.liveSuspect.stroke}
          strokeWidth={s.rank === 1 ? 3 : 1.5}
          dash={[8, 6]}
          strokeScaleEnabled={false}
          listening={false}
        />
      ))}
      {suspects.map((s) => (
        <Text
          key={`t${s.rank}`}
          x={s.x - px(8)}
          y={s.y - px(8)}
          width={px(16)}
          align="center"
          text={String(s.rank)}
          fontSize={px(14)}
          fontStyle="bold"
          fill={look.liveSuspect.stroke}
          listening={false}
        />
      ))}
      {probes.map((p, i) => (
        <Rect
          key={`p${i}`}
          x={p.x - px(side / 2)}
          y={p.y - px(side / 2)}
          width={px(side)}
          height={px(side)}
          fill={look.nextProbe.fill}
          stroke={look.nextProbe.stroke}
          strokeWidth={2}
          strokeScaleEnabled={false}
          listening={false}
        />
      ))}
      {(numbered ? probes : []).map((p, i) => (
        <Text
          key={`n${i}`}
          x={p.x - px(11)}
          y={p.y - px(7)}
          width={px(22)}
          align="center"
          text={String(i + 1)}
          fontSize={px(14)}
          fontStyle="bold"
          fill={look.nextProbe.stroke}
          listening={false}
        />
      ))}
    </>
  );
}
