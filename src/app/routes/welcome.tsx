import { Link } from "react-router";
import { PageHeader } from "../../components/ui/page-header";
import { useDocumentTitle } from "../../lib/use-document-title";
import { useSignedIn } from "../shell/session-context";

/** The first screen of a new company: what to do first, in order. */
export function Component() {
  useDocumentTitle("Welcome");
  const { membership } = useSignedIn();
  const steps = [
    { to: "/stores?new=1", title: "Create your first store", text: "Its name, address and time zone." },
    {
      to: "/stores",
      title: "Upload its floor plan",
      text: "A PNG or JPEG, or a blank plan of the store's size; then set the scale with one line of known length.",
    },
    {
      to: "/detectors",
      title: "Add your detectors",
      text: "Their transport delay and alarm level make the maps right.",
    },
    {
      to: "/team",
      title: "Invite your team",
      text: "Lead techs map stores, technicians sweep, engineers keep the books.",
    },
  ];
  return (
    <>
      <PageHeader
        title={`Welcome to Plumeline, ${membership.companyName}`}
        description="Your company is open and you are its owner. Four steps get the first sweep going."
      />
      <ol className="grid max-w-3xl gap-3">
        {steps.map((s, i) => (
          <li key={s.title} className="edge rounded-lg bg-surface p-4">
            <Link to={s.to} className="text-lg font-bold">
              {i + 1}. {s.title}
            </Link>
            <p className="mt-1 text-muted">{s.text}</p>
          </li>
        ))}
      </ol>
      <p className="mt-6">
        <Link to="/help">How Plumeline works, role by role</Link>
      </p>
    </>
  );
}
