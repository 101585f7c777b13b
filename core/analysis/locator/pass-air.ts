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

/** Whether a pass stilled fixture `k` whose fans run in the plan's own air. */
export function stilledByAPass(air: ReadingAir, k: number): boolean {
  return air.models[0][k].fans && air.models.some((m) => !m[k].fans);
}
