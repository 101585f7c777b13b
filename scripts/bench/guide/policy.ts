import type { World } from "../simulate/scenario";
import type { Leg } from "../simulate/store-types";

/** Where the technician would mark the leak now, after the latest reading (null: nowhere yet). */
export interface PolicyStep {
  mark: { x: number; y: number } | null;
}

export interface PolicyStart {
  world: World;
  /** The leg being swept when the first alarm came, and the arc length of that stop. */
  leg: Leg;
  alarmAtS: number;
}

/**
 * What a simulated technician does after an alarm: takes readings through `world.technician` and
 * yields after each one where they would mark the leak. It returns "marked" when done, or "nothing"
 * when the alarm led nowhere (a blip): the sweep then goes on from where the alarm came. The loop
 * stops it after 40 readings from the first alarm.
 */
export interface Policy {
  name: string;
  run(start: PolicyStart): Generator<PolicyStep, "marked" | "nothing", void>;
}
