import { Link } from "react-router";
import type { Role } from "#core/domain/roles";
import { PageHeader } from "../../../components/ui/page-header";
import { topicsFor, type HelpTopic } from "../model/help-topics";

/** The list of help topics, those for the member's role first. */
export function HelpIndex({ role }: { role: Role }) {
  return (
    <>
      <PageHeader title="Help" description="Short guides to the work in Plumeline. Those for your role come first." />
      <ul className="grid gap-3 sm:grid-cols-2">
        {topicsFor(role).map((t) => (
          <li key={t.id} className="edge rounded-lg bg-surface p-4">
            <Link to={`/help/${t.id}`} className="text-lg font-bold">
              {t.title}
            </Link>
            <p className="mt-1 text-muted">{t.summary}</p>
          </li>
        ))}
      </ul>
    </>
  );
}

export function HelpTopicPage({ topic }: { topic: HelpTopic }) {
  return (
    <article className="max-w-prose">
      <p className="mb-2">
        <Link to="/help">All help topics</Link>
      </p>
      <PageHeader title={topic.title} description={topic.summary} />
      {topic.sections.map((s) => (
        <section key={s.heading} className="mb-6">
          <h2 className="mb-2 text-xl font-bold">{s.heading}</h2>
          {s.paragraphs.map((p) => (
            <p key={p} className="mb-2">
              {p}
            </p>
          ))}
          {s.steps ? (
            <ol className="ml-6 list-decimal space-y-1">
              {s.steps.map((step) => (
                <li key={step}>{step}</li>
              ))}
            </ol>
          ) : null}
        </section>
      ))}
    </article>
  );
}
