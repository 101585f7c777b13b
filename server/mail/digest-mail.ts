import type { DueItem } from "#core/contracts/compliance";
import { readableSource } from "#core/domain/compliance/citations";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";

const STATE_WORDS: Record<DueItem["state"], string> = {
  overdue: "OVERDUE",
  "due-today": "due today",
  "due-soon": "due soon",
  upcoming: "upcoming",
};

/** The daily digest as plain text: overdue first, each line with its due date, place, rule source and link. */
export function digestMail(args: {
  companyName: string;
  localDate: string;
  items: DueItem[];
  appUrl: string;
  days: number;
}) {
  const lines = args.items.map((i) => {
    const where = [i.storeName, i.systemName].filter(Boolean).join(" · ") || "Company";
    const when = i.dueOn
      ? `${formatCalendarDay(i.dueOn)} (${STATE_WORDS[i.state]}${i.daysLeft !== null && i.daysLeft < 0 ? `, ${-i.daysLeft} days late` : ""})`
      : "no date on record (overdue)";
    return [
      `- ${when}: ${i.what}`,
      `  ${where}`,
      `  Rule: ${readableSource(i.source)}`,
      `  Records: ${args.appUrl}${i.link}`,
    ].join("\n");
  });
  const subject = args.items.length
    ? `Plumeline: ${args.items.length} item${args.items.length === 1 ? "" : "s"} due in the next ${args.days} days – ${args.companyName}`
    : `Plumeline: nothing due in the next ${args.days} days – ${args.companyName}`;
  return {
    subject,
    text: [
      `What falls due for ${args.companyName} from ${formatCalendarDay(args.localDate)} through the next ${args.days} days, including anything overdue.`,
      "",
      ...(lines.length ? lines : ["Nothing is due. The Today screen has the full picture."]),
      "",
      `Today screen: ${args.appUrl}/today`,
      "",
      "You receive this daily as an owner or engineer of the company on Plumeline.",
    ].join("\n"),
  };
}
