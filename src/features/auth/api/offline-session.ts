import { sessionInfo, type SessionInfo } from "#core/contracts/auth";

// The last session the server confirmed, kept on the device so the app (and a sweep in
// progress) opens after a reload without a connection. The CSRF token is left out: the first
// write after the connection returns fetches a fresh one.
const KEY = "plumeline.session";

export function rememberSession(info: SessionInfo): void {
  try {
    if (info.user) localStorage.setItem(KEY, JSON.stringify({ ...info, csrfToken: "" }));
    else localStorage.removeItem(KEY);
  } catch {
    // storage blocked: the app still works online
  }
}

export function lastKnownSession(): SessionInfo | null {
  try {
    const raw = localStorage.getItem(KEY);
    if (!raw) return null;
    const parsed = sessionInfo.safeParse(JSON.parse(raw));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}
