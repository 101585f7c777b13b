import { createContext, useContext } from "react";
import { READINGS_PATH, readableSource, UNCONFIRMED } from "#core/domain/compliance/citations";
import { readingTextOf } from "#core/domain/compliance/readings";

// "(reading)" or "(40 CFR 84.106; reading)": the marker stands alone inside a citation's brackets.
const MARKER = new RegExp(`(?<=[(;] ?)(${UNCONFIRMED})(?=[;)])`);

/**
 * The readings the owner has accepted (their words), where a screen knows them; null where it does
 * not, and the marker then says nothing about acceptance (docs/decisions/0048-accepting-readings.md).
 */
export const AcceptedReadingsContext = createContext<ReadonlySet<string> | null>(null);

/**
 * A text for people in which each "reading" marker links to the rule-profile page's list of
 * readings (a plain link: cautions also render outside the router). `accepted` tells the reader
 * whether the owner has accepted the reading behind it.
 */
export function Readable({ text, accepted = null }: { text: string; accepted?: boolean | null }) {
  const parts = text.split(MARKER);
  const title =
    accepted === null
      ? "How the product reads a rule whose text was not confirmed: see the rule profile"
      : accepted
        ? "Accepted by the owner: see the rule profile"
        : "Not accepted by the owner: see the rule profile";
  return (
    <>
      {parts.map((part, i) =>
        part === UNCONFIRMED && i % 2 === 1 ? (
          <a key={i} className="underline decoration-dotted" href={READINGS_PATH} title={title}>
            {accepted === null ? part : `${part}, ${accepted ? "accepted" : "not accepted"}`}
          </a>
        ) : (
          part
        ),
      )}
    </>
  );
}

/** A rule source as people read it: the citation, with any "reading" marker linked and its acceptance shown. */
export function SourceText({ source }: { source: string }) {
  const acceptedTexts = useContext(AcceptedReadingsContext);
  const reading = acceptedTexts ? readingTextOf(source) : null;
  return <Readable text={readableSource(source)} accepted={reading === null ? null : acceptedTexts!.has(reading)} />;
}
