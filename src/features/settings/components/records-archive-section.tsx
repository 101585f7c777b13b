/** The owner's download of the company's whole record set (docs/decisions/0046-owners-record-archive.md). */
export function RecordsArchiveSection() {
  return (
    <section aria-labelledby="records-archive-heading" className="mt-10 space-y-3">
      <h2 id="records-archive-heading" className="text-xl font-bold">
        All records in one archive
      </h2>
      <p className="max-w-prose text-muted">
        A zip file with one spreadsheet (CSV) per kind of record — systems and their revisions, charge added, leak
        checks, findings and their steps, verification tests, chronic-leaker filings, the compliance audit trail, sweeps
        and readings — plus the leak-rate statement of every system and the report of every submitted sweep. For an
        auditor, or to keep when leaving the service. Every download is written to the security log.
      </p>
      <a
        className="inline-block rounded-md bg-accent px-4 py-2 font-semibold text-on-accent edge border-accent hover:bg-accent-strong"
        href="/api/company/records-archive.zip"
        download
      >
        Download all records (.zip)
      </a>
    </section>
  );
}
