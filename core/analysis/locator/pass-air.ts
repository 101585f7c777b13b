import type { LocatorFixture, LocatorInput, LocatorPass } from "../../contracts/locator-input";

/**
 * The air each reading was taken in. Model 0 is the plan as given (the first pass, and every reading
 * without a pass); a pass that stops fans or runs a defrost gets a model of its own in which the
 * fixtures it covers (one, or all when it names none) have no fans running: still air near them.
 */
export interface ReadingAir {
  /** The fixtures as each model sees them; `models[0]` is `plan.fixtures` itself. */
  readonly models: readonly (readonly LocatorFixture[])[];
  /** Model of each reading. */
  readonly modelOfReading: Int32Array;
}

/** A pass with its fans stopped or in a defrost stills the air it covers (the evaporator fans stop). */
export function stillsAir(pass: Pick<LocatorPass, "fans" | "defrost">): boolean {
  return pass.fans === "stopped" || pass.defrost;
}

export function fixturesInPass(fixtures: readonly LocatorFixture[], pass: LocatorPass): LocatorFixture[] {
  return fixtures.map((f) =>
    f.fans && stillsAir(pass) && (pass.fixture === undefined || pass.fixture === f.id) ? { ...f, fans: false } : f,
  );
}

/** One model per pass that changes the air and holds readings; passes that change nothing share model 0. */
export function readingAir(
  input: Pick<LocatorInput, "plan" | "readings"> & { passes?: LocatorInput["passes"] },
): ReadingAir {
  const fixtures = input.plan.fixtures;
  const models: (readonly LocatorFixture[])[] = [fixtures];
  const modelOfPass = new Map<string, number>();
  const modelOfReading = new Int32Array(input.readings.length);
  // callers that build the input in code (benchmarks, the Walk screen) may leave `passes` out
  const byId = new Map((input.passes ?? []).map((p) => [p.id, p]));
  input.readings.forEach((r, i) => {
    if (r.pass === undefined) return;
    let m = modelOfPass.get(r.pass);
    if (m === undefined) {
      const pass = byId.get(r.pass);
      const own = pass ? fixturesInPass(fixtures, pass) : fixtures;
      m = own.some((f, k) => f !== fixtures[k]) ? models.push(own) - 1 : 0;
      modelOfPass.set(r.pass, m);
    }
    modelOfReading[i] = m;
  });
  return { models, modelOfReading };
}

/** The readings taken while fixture `k`'s fans ran (its own air model says so). */
export function readingsWithFansOn(air: ReadingAir, k: number): number[] {
  const keep: number[] = [];
  for (let i = 0; i < air.modelOfReading.length; i++) if (air.models[air.modelOfReading[i]][k].fans) keep.push(i);
  return keep;
}

/** Whether a pass (of the `only` models, when given) stilled fixture `k` whose fans run in the plan's own air. */
export function stilledByAPass(air: ReadingAir, k: number, only: readonly boolean[] | null = null): boolean {
  return air.models[0][k].fans && air.models.some((m, j) => !m[k].fans && (!only || only[j]));
}

/**
 * A pass's readings count in the joint fit by the share of their scatter one source in their own air
 * explains, to this power: a stilled case whose front reads nothing at first and then rises, or a stilled
 * neighbour that collected the leaking case's gas, explains itself poorly and barely moves the first
 * pass's spot. Tuned on the pinpoint-pass stores 1–12, 8601–8645 and 8801–8830 (docs/benchmarks.md).
 */
export const PASS_WEIGHT_POWER = 3;
/**
 * Only a pass that explains itself at least this well takes over placing the leak in the fixture it
 * stilled (that fixture's mixed first-pass readings then count as its level only, mixed-level.ts);
 * otherwise those readings keep saying where along the fixture the gas is. Tuned as above.
 */
export const PASS_TRUSTED_SHARE = 0.9;

/** Per air model: whether its readings may take over placing the leak, and its readings' weight factor. */
export function passWeighing(explained: readonly number[]): { trusted: boolean[]; weightOfModel: number[] } {
  return {
    trusted: explained.map((r, m) => m === 0 || r >= PASS_TRUSTED_SHARE),
    weightOfModel: explained.map((r, m) => (m === 0 ? 1 : r ** PASS_WEIGHT_POWER)),
  };
}
