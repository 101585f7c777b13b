/**
 * Where to go after signing in. Only a path on this site is accepted, so a crafted
 * `?next=//elsewhere.example` link cannot send someone off-site (an open redirect).
 */
export function safeNext(next: string | null): string {
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return "/";
  if (next.startsWith("/sign-in")) return "/";
  return next;
}

export function signInPath(returnTo: string): string {
  return returnTo === "/" ? "/sign-in" : `/sign-in?next=${encodeURIComponent(returnTo)}`;
}
