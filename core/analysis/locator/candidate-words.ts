import type { LocatorFixture, LocatorRiskPoint } from "../../contracts/locator-input";
import type { Nearest } from "./nearest-features";

// Plain-words reason and next check for a suspect spot, in the words of docs/product.md.

const FIXTURE_WORDS: Record<LocatorFixture["kind"], string> = {
  "open-case": "open case",
  "island-case": "island case",
  "door-case": "glass-door case",
  "walk-in": "walk-in",
  "machine-room": "machine room",
};
const RISK_WORDS: Record<LocatorRiskPoint["kind"], string> = {
  "line-set": "line-set drop",
  valve: "valve",
  coil: "coil",
};

export interface CandidateFacts {
  alternate: boolean;
  supportCount: number;
  peakPpm: number;
  backgroundPpm: number;
  fixture: Nearest<LocatorFixture> | null;
  riskPoint: Nearest<LocatorRiskPoint> | null;
  oneSided: boolean;
  radius: number;
}

const r1 = (v: number) => (Math.round(v * 10) / 10).toString();

export function candidateReason(f: CandidateFacts): string {
  const where = f.fixture
    ? f.fixture.distance === 0
      ? `inside ${FIXTURE_WORDS[f.fixture.item.kind]} ${f.fixture.item.id}`
      : `${r1(f.fixture.distance)} m from ${FIXTURE_WORDS[f.fixture.item.kind]} ${f.fixture.item.id}`
    : "in open floor";
  const lead = f.alternate
    ? `Alternative spot ${where}: the readings fit a source here almost as well as at a higher-ranked spot`
    : `${f.supportCount} readings nearby rise to ${r1(f.peakPpm)} ppm against a background of ${r1(f.backgroundPpm)} ppm; one source ${where} explains them best`;
  return f.oneSided ? `${lead}. The readings come from one pass, so the side of the path is uncertain.` : `${lead}.`;
}

export function candidateNextCheck(f: CandidateFacts): string {
  const parts: string[] = [];
  if (f.riskPoint && f.riskPoint.distance <= Math.max(1.5, f.radius)) {
    parts.push(
      `look at the ${RISK_WORDS[f.riskPoint.item.kind]} ${f.riskPoint.item.id} (${r1(f.riskPoint.distance)} m away) first`,
    );
  }
  const fx = f.fixture?.item;
  if (fx && fx.fans && f.fixture!.distance <= 0.5) {
    parts.push(
      `stop the fans of ${fx.id} (or wait for defrost), then re-check every 0.6 m within ${r1(f.radius)} m of this spot`,
    );
  } else {
    parts.push(`re-check every 0.6 m within ${r1(f.radius)} m of this spot, probe slow and close to joints`);
  }
  if (f.oneSided) parts.push("make a pass along the other face to tell which side the leak is on");
  const text = parts.join("; ");
  return text.charAt(0).toUpperCase() + text.slice(1) + ".";
}
