/**
 * Labels for copies of fixtures (duplicate, array), so a row of cases reads "Freezer",
 * "Freezer 2", "Freezer 3" instead of three "Freezer"s a technician cannot tell apart.
 * A label ending in a number counts on from it ("Case 4" → "Case 5", zero padding kept:
 * "C09" → "C10"); one without gets a number after a space, the original counting as 1.
 * A number already used on the plan (compared without case or outer spaces) is skipped. An
 * empty label stays empty: there is nothing to number.
 */
import { LABEL_MAX } from "#core/contracts/fixtures";

const key = (label: string) => label.trim().toLocaleLowerCase();

interface Counter {
  stem: string;
  /** Between stem and number: a space after a word, nothing after a number's own stem or "#". */
  sep: string;
  /** The last number used (the original's); copies count on from the next. */
  last: bigint;
  /** Digits the number is padded to ("C09" keeps two). */
  width: number;
}

function counterOf(label: string): Counter {
  const m = /^(.*?)(\d+)$/.exec(label);
  if (m) return { stem: m[1], sep: "", last: BigInt(m[2]), width: m[2].length };
  // "Case-" or "Bay #" take the number straight after; a word gets a space first.
  return { stem: label, sep: /[\p{L}\p{N})\]]$/u.test(label) ? " " : "", last: 1n, width: 1 };
}

function compose(c: Counter, n: bigint): string {
  const digits = n.toString().padStart(c.width, "0");
  // A long label gives up the end of its stem, never its number (labels are at most LABEL_MAX).
  return c.stem.slice(0, Math.max(0, LABEL_MAX - c.sep.length - digits.length)) + c.sep + digits;
}

/**
 * For each source label, the labels of its `copies` copies in order (copy 1 first), none of
 * them equal to a label in `onPlan` or to one given earlier in the answer. `result[j][k - 1]`
 * is the label of copy k of source j.
 */
export function copyLabels(sources: readonly string[], copies: number, onPlan: Iterable<string>): string[][] {
  if (!(Number.isInteger(copies) && copies >= 0))
    throw new RangeError(`copyLabels: copies must be a whole number of 0 or more (got ${copies})`);
  const taken = new Set<string>();
  for (const label of onPlan) taken.add(key(label));
  return sources.map((source) => {
    if (source.trim() === "") return Array.from({ length: copies }, () => source);
    const c = counterOf(source);
    const out: string[] = [];
    for (let k = 0; k < copies; k++) {
      let label: string;
      do {
        c.last += 1n;
        label = compose(c, c.last);
      } while (taken.has(key(label)));
      taken.add(key(label));
      out.push(label);
    }
    return out;
  });
}
