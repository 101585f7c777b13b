import { Circle, Line, Rect, Text } from "react-konva";
import type { LiveLead, LiveProbe, LiveSuspect } from "#core/analysis/guide/live-guide";
import { LEAD_MARK_PX, markLooks } from "../model/plan-marks";

/**
 * The live estimate on the Walk plan: each suspect as a dashed circle of its radius with its rank, each
 * next probe point as a numbered square in walking order, and before any spot is credible, the
 * provisional lead (where the gas is strongest so far) as a dotted crosshair with no radius and no fill,
 * so it is never taken for a suspect (docs/decisions/0077, 0140). Drawn in plan metres; sizes on screen
 * are divided by the zoom so they stay the same at every zoom.
 */
export function LiveMarks({
  suspects,
  lead = null,
  probes,
  zoom,
  highContrast,
}: {
  suspects: readonly LiveSuspect[];
  lead?: LiveLead | null;
  probes: readonly LiveProbe[];
  zoom: number;
  highContrast: boolean;
}) {
  const look = markLooks(highContrast);
  const px = (n: number) => n / zoom;
  const r = px(LEAD_MARK_PX);
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
      {lead ? (
        <>
          <Circle
            x={lead.x}
            y={lead.y}
            radius={r}
            stroke={look.liveLead.stroke}
            strokeWidth={2.5}
            dash={[3, 3]}
            strokeScaleEnabled={false}
            listening={false}
          />
          <Line
            points={[lead.x - 1.6 * r, lead.y, lead.x + 1.6 * r, lead.y]}
            stroke={look.liveLead.stroke}
            strokeWidth={2}
            strokeScaleEnabled={false}
            listening={false}
          />
          <Line
            points={[lead.x, lead.y - 1.6 * r, lead.x, lead.y + 1.6 * r]}
            stroke={look.liveLead.stroke}
            strokeWidth={2}
            strokeScaleEnabled={false}
            listening={false}
          />
        </>
      ) : null}
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
