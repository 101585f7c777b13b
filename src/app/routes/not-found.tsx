import { Link } from "react-router";
import { useDocumentTitle } from "../../lib/use-document-title";

export function Component() {
  useDocumentTitle("Page not found");
  return (
    <section className="space-y-4 py-6">
      <h1 className="text-3xl font-bold">Page not found</h1>
      <p className="max-w-prose">There is no page at this address, or it is not open to your role in this company.</p>
      <p>
        <Link to="/">Go to the stores</Link>
      </p>
    </section>
  );
}
