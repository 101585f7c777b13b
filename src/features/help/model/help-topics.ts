import type { Role } from "#core/domain/roles";

export interface HelpSection {
  heading: string;
  paragraphs: readonly string[];
  steps?: readonly string[];
}

export interface HelpTopic {
  id: string;
  title: string;
  /** One line under the title in the topic list. */
  summary: string;
  /** The roles this topic is written for, listed first for them. */
  forRoles: readonly Role[];
  sections: readonly HelpSection[];
}

const SAFETY =
  "Walk-ins and machine rooms can fill with refrigerant and leave too little oxygen to breathe; some refrigerants burn, CO2 systems run at very high pressure and ammonia is toxic. Follow the site's rules, the room's detector and your certification, and local codes always come first.";

/** Short, plain help per role. Product words as in docs/product.md. */
export const HELP_TOPICS: readonly HelpTopic[] = [
  {
    id: "sweep",
    title: "How a sweep works",
    summary: "Walking a store with the detector and tapping readings on the plan.",
    forRoles: ["technician", "lead-tech"],
    sections: [
      {
        heading: "Before you start",
        paragraphs: [
          "Pick the store, the plan and the detector you carry. Plumeline copies the detector's transport delay, response time and alarm level into the sweep; a detector whose calibration or bump check is overdue shows a warning.",
          SAFETY,
        ],
      },
      {
        heading: "Tapping readings",
        paragraphs: [
          "Walk the case fronts with the probe at the grille. Each time you stop, tap where you are on the plan and enter what the detector shows; 0 is one tap. Readings are kept on the phone first, so nothing is lost without signal and they upload when the network returns.",
          "The sample takes a few seconds to travel up the probe hose. When a reading is at or above the alarm, the plan marks where the air was really drawn in, about one transport delay back along your path, and suggests closer re-checks around it.",
        ],
        steps: [
          "Tap your position, then the value on the keypad.",
          "On an alarm, walk back to the marked spot and re-check in short steps.",
          "When the gas seems spread over a whole case or room, stop the fans or start a defrost and re-check (see “Reading the field map”).",
          "Submit when the store is covered; the analysis runs on the server.",
        ],
      },
      {
        heading: "Leaving half-way",
        paragraphs: [
          "You can leave the Walk screen at any time; the readings stay on the phone and the sweep stays in progress until it is submitted.",
        ],
      },
    ],
  },
  {
    id: "field-map",
    title: "Reading the field map",
    summary: "Colours, hatching, suspect spots and what the diagnostics ask for.",
    forRoles: ["engineer", "lead-tech", "technician", "owner"],
    sections: [
      {
        heading: "Colours and hatching",
        paragraphs: [
          "The colour shows the concentration the readings support after moving each one back to where its air was sampled. Walls, shelving runs and closed rooms block the spread, so gas on one side of a wall says nothing about the other side.",
          "Hatched or clear areas were not sampled closely enough to say anything: they are unknown, not clean.",
        ],
      },
      {
        heading: "Suspect spots",
        paragraphs: [
          "Numbered rings are the places where a leak most likely is, best first. The ring's radius is how far the true leak may be from its centre; a wide ring means the readings are few or far apart. Each spot names the nearest fixture and risk point (line-set drop, valve, coil) and the next check to make.",
        ],
      },
      {
        heading: "Diagnostics",
        paragraphs: [
          "Gas spread evenly over a case or walk-in usually means the fans are mixing it: stop the fans or defrost and re-check to pinpoint it.",
          "Readings near a benign-source zone (aerosol storage, for example) may be refrigerant that is no leak; the map says when a zone explains them.",
          "A supply-air check confirms a leak inside a case: gas in the supply air that the return air does not explain points at the coil.",
          "“No credible leak” means no spot stands out from the background on this sweep; it is not a certificate that the system is tight.",
        ],
      },
    ],
  },
  {
    id: "mapping",
    title: "Mapping a store",
    summary: "Plans, scale, fixtures and systems.",
    forRoles: ["lead-tech", "owner"],
    sections: [
      {
        heading: "Plan and scale",
        paragraphs: [
          "Upload the floor plan (PNG or JPEG) or start a blank plan of a given size, then draw a line of known length to set the scale. Everything is kept in metres and shown in your units.",
        ],
      },
      {
        heading: "Fixtures",
        paragraphs: [
          "Draw the cases, walk-ins, machine room, walls and shelving runs, and mark line-set drops, valves and coils: leaks cluster there. Rows of identical cases are quickest with duplicate and array. Link each fixture to its system so findings and leak rates reach the right rack.",
        ],
      },
    ],
  },
  {
    id: "records",
    title: "Keeping the records",
    summary: "Findings, repairs, verification tests, charge added and what falls due.",
    forRoles: ["engineer", "owner"],
    sections: [
      {
        heading: "From suspect spot to closed finding",
        paragraphs: [
          "Turn a suspect spot into a finding, confirm it at a component, record the repair and the verification tests. Every step is kept with who and when; nothing is overwritten.",
        ],
      },
      {
        heading: "Charge added and leak rates",
        paragraphs: [
          "Record every addition of refrigerant with its date, amount and reason. Plumeline computes each system's leak rate under the company's rule profile, flags thresholds and lists what falls due on Today, each with the rule it comes from.",
        ],
      },
    ],
  },
  {
    id: "store-contact",
    title: "For store managers",
    summary: "What you see for your store.",
    forRoles: ["store-contact"],
    sections: [
      {
        heading: "Your store's view",
        paragraphs: [
          "You see your store's findings, what falls due and the reports your service team sends. Ask the team for anything else; they keep the records.",
          SAFETY,
        ],
      },
    ],
  },
];

/** The topics for a role: those written for it first, then the rest. */
export function topicsFor(role: Role): HelpTopic[] {
  const mine = HELP_TOPICS.filter((t) => t.forRoles.includes(role));
  return [...mine, ...HELP_TOPICS.filter((t) => !t.forRoles.includes(role))];
}
