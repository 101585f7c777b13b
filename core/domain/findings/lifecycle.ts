import type { Permission } from "../roles";

/**
 * The finding lifecycle as data: suspected → confirmed → repaired → (initial verification test,
 * follow-up verification test) → verified → closed, or dismissed with a reason. A failed test
 * sends the finding back to confirmed: the leak is still there and needs another repair
 * (40 CFR 82.152 "verification test" definitions [S:R8]; the loop back is our reading). Under EU F-gas
 * rules there are no verification tests: a repaired finding closes once a leak check of its system
 * found no leak on or after the repair day (the re-check, Regulation (EU) 2024/573 [S:E6]). A finding
 * still open when its system is retired closes as "left service" instead (docs/decisions/0166).
 */
export type FindingStatus = "suspected" | "confirmed" | "repaired" | "verified" | "closed" | "dismissed";
export type FindingEventKind =
  | "found"
  | "confirmed"
  | "repaired"
  | "initial-test"
  | "follow-up-test"
  | "closed"
  | "closed-left-service"
  | "dismissed";
export type FindingAction =
  | "confirm"
  | "repair"
  | "initial-test"
  | "follow-up-test"
  | "close"
  | "close-left-service"
  | "dismiss";
/** In the order the finding screen offers them: closing because the system left service comes first once it has. */
export const FINDING_ACTIONS: readonly FindingAction[] = [
  "close-left-service",
  "confirm",
  "repair",
  "initial-test",
  "follow-up-test",
  "close",
  "dismiss",
];

export interface LifecycleEvent {
  kind: FindingEventKind;
  status: FindingStatus;
  on: string;
  result?: "passed" | "failed" | null;
}

/** Who may take each action (roles.ts grants): technicians and lead techs record, engineers and owners close and dismiss. */
export const ACTION_PERMISSION: Record<FindingAction, Permission> = {
  confirm: "findings.record",
  repair: "findings.record",
  "initial-test": "findings.record",
  "follow-up-test": "findings.record",
  close: "findings.close",
  "close-left-service": "findings.close",
  dismiss: "findings.close",
};

export const ACTION_LABELS: Record<FindingAction, string> = {
  confirm: "Confirm the leak",
  repair: "Record the repair",
  "initial-test": "Record the initial verification test",
  "follow-up-test": "Record the follow-up verification test",
  close: "Close the finding",
  "close-left-service": "Close: the system left service",
  dismiss: "Dismiss the finding",
};

/** Where the finding stands in its repair: whether an initial test passed since the latest repair. */
export function initialTestPassedSinceRepair(events: readonly LifecycleEvent[]): LifecycleEvent | null {
  let passed: LifecycleEvent | null = null;
  for (const e of events) {
    if (e.kind === "repaired") passed = null;
    else if (e.kind === "initial-test") passed = e.result === "passed" ? e : null;
  }
  return passed;
}

export function currentStatus(events: readonly LifecycleEvent[]): FindingStatus {
  return events.at(-1)?.status ?? "suspected";
}

/**
 * How the company's rules verify a repair: the US parts' initial and follow-up verification tests, or
 * the EU re-check — a leak check with no leak found on or after the repair day, within a month
 * (Regulation (EU) 2024/573 [S:E6]); the day of each clean leak check of the finding's system is given.
 */
export type Verification = { by: "tests" } | { by: "recheck"; cleanChecksOn: readonly string[] };
const BY_TESTS: Verification = { by: "tests" };

/** The day of the latest repair, if any. */
function repairedOn(events: readonly LifecycleEvent[]): string | null {
  return events.findLast((e) => e.kind === "repaired")?.on ?? null;
}

export type Transition = { ok: true; kind: FindingEventKind; status: FindingStatus } | { ok: false; message: string };

/**
 * The event an action adds and the status it leads to, or why it is not allowed now. The
 * message is shown as is (409), so it says what state the finding is in and what comes next.
 */
export function transition(
  events: readonly LifecycleEvent[],
  action: FindingAction,
  result?: "passed" | "failed",
  verification: Verification = BY_TESTS,
  /** The day the finding's system left service (store calendar), or null while it is in service. */
  retiredOn: string | null = null,
): Transition {
  const status = currentStatus(events);
  const refuse = (why: string): Transition => ({ ok: false, message: `This finding is ${status}: ${why}` });
  if (action === "close-left-service") return closeLeftService(events, verification, retiredOn, refuse);
  if (verification.by === "recheck") {
    if (action === "initial-test" || action === "follow-up-test")
      return refuse("under these rules a repair is verified by a leak check after it, not by verification tests.");
    if (action === "close" && status === "repaired") {
      const repair = repairedOn(events);
      return repair && verification.cleanChecksOn.some((d) => d >= repair)
        ? { ok: true, kind: "closed", status: "closed" }
        : refuse(
            "record the leak check after the repair first (no leak found, within a month of the repair), then close it.",
          );
    }
  }
  switch (action) {
    case "confirm":
      return status === "suspected"
        ? { ok: true, kind: "confirmed", status: "confirmed" }
        : refuse("only a suspected finding can be confirmed.");
    case "repair":
      return status === "confirmed"
        ? { ok: true, kind: "repaired", status: "repaired" }
        : refuse("only a confirmed leak can be repaired (confirm it first).");
    case "initial-test": {
      if (status !== "repaired") return refuse("the initial verification test follows a repair.");
      if (initialTestPassedSinceRepair(events))
        return refuse("the initial verification test has passed; record the follow-up test next.");
      if (!result) return { ok: false, message: "Give the test result: passed or failed." };
      return { ok: true, kind: "initial-test", status: result === "passed" ? "repaired" : "confirmed" };
    }
    case "follow-up-test": {
      if (status !== "repaired")
        return refuse("the follow-up verification test follows a repair and a passed initial test.");
      if (!initialTestPassedSinceRepair(events)) return refuse("record a passed initial verification test first.");
      if (!result) return { ok: false, message: "Give the test result: passed or failed." };
      return { ok: true, kind: "follow-up-test", status: result === "passed" ? "verified" : "confirmed" };
    }
    case "close":
      return status === "verified"
        ? { ok: true, kind: "closed", status: "closed" }
        : refuse("only a verified repair can be closed (both verification tests passed).");
    case "dismiss":
      return status === "suspected" || status === "confirmed"
        ? { ok: true, kind: "dismissed", status: "dismissed" }
        : refuse("only a suspected or confirmed finding can be dismissed.");
  }
}

/**
 * Closing a finding because its system left service (docs/decisions/0166): once the system is retired,
 * a leak still open on it can no longer be repaired and verified there, and the rules owe no more
 * repair, test or leak check on equipment out of service. Not for a finding whose repair is verified
 * (it closes as verified) nor one already closed or dismissed.
 */
function closeLeftService(
  events: readonly LifecycleEvent[],
  verification: Verification,
  retiredOn: string | null,
  refuse: (why: string) => Transition,
): Transition {
  const status = currentStatus(events);
  if (status === "closed" || status === "dismissed") return refuse("it needs no closing.");
  if (transition(events, "close", undefined, verification).ok)
    return refuse("its repair is verified, so close it as verified (Close the finding).");
  if (retiredOn === null)
    return refuse("its system is in service; a finding closes this way only once its system has been retired.");
  return { ok: true, kind: "closed-left-service", status: "closed" };
}

/** Actions that make sense next, for the buttons on the finding screen. */
export function nextActions(
  events: readonly LifecycleEvent[],
  verification: Verification = BY_TESTS,
  retiredOn: string | null = null,
): FindingAction[] {
  return FINDING_ACTIONS.filter((a) => transition(events, a, "passed", verification, retiredOn).ok);
}

export function isOpen(status: FindingStatus): boolean {
  return status !== "closed" && status !== "dismissed" && status !== "verified";
}
