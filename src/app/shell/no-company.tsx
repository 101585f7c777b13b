import { ContrastToggle } from "./contrast-toggle";
import { SignOutButton } from "./sign-out-button";

/** Signed in, but no membership left (every company removed this person). */
export function NoCompany() {
  return (
    <main id="main" className="mx-auto max-w-xl space-y-4 px-4 py-10">
      <p className="text-2xl font-bold text-accent">Plumeline</p>
      <h1 className="text-2xl font-bold">You are not a member of any company</h1>
      <p>Ask an owner of your company to invite you again. The invitation arrives by e-mail with a link to join.</p>
      <div className="flex flex-wrap gap-2">
        <SignOutButton />
        <ContrastToggle />
      </div>
    </main>
  );
}
