import { READINGS_PATH, readableSource, UNCONFIRMED } from "#core/domain/compliance/citations";

// "(reading)" or "(40 CFR 84.106; reading)": the marker stands alone inside a citation's brackets.
const MARKER = new RegExp(`(?<=[(;] ?)(${UNCONFIRMED})(?=[;)])`);

/**
 * A text for people in which each "reading" marker links to the rule-profile page's list of
 * readings (a plain link: cautions also render outside the router).
 */
export function Readable({ text }: { text: string }) {
  const parts = text.split(MARKER);
  return (
    <>
      {parts.map((part, i) =>
        part === UNCONFIRMED && i % 2 === 1 ? (
          <a
            key={i}
            className="underline decoration-dotted"
            href={READINGS_PATH}
            title="How the product reads a rule whose text was not confirmed: see the rule profile"
          >
            {part}
          </a>
        ) : (
          part
        ),
      )}
    </>
  );
}

/** A rule source as people read it: the citation, with any "reading" marker linked. */
export function SourceText({ source }: { source: string }) {
  return <Readable text={readableSource(source)} />;
}
