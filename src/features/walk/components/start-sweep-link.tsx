import { Link } from "react-router";

/** The store page's entry to a sweep (slot it where the store's actions are). */
export function StartSweepLink({ storeId }: { storeId: string }) {
  return (
    <Link
      to={`/stores/${storeId}/walk`}
      className="inline-flex min-h-12 items-center rounded-md bg-accent px-4 font-bold text-on-accent no-underline"
    >
      Start a sweep
    </Link>
  );
}
