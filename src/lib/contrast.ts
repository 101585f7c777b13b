// High contrast is remembered per device (a bright store calls for it on the phone, not the desk).
const STORAGE_KEY = "plumeline.contrast";
const CLASS_NAME = "hc";

export function storedHighContrast(): boolean {
  try {
    return localStorage.getItem(STORAGE_KEY) === "high";
  } catch {
    return false; // storage may be blocked (private mode); fall back to the calm palette
  }
}

export function setHighContrast(on: boolean): void {
  document.documentElement.classList.toggle(CLASS_NAME, on);
  try {
    if (on) localStorage.setItem(STORAGE_KEY, "high");
    else localStorage.removeItem(STORAGE_KEY);
  } catch {
    // not remembered, but still applied for this visit
  }
}

export function applyStoredContrast(): void {
  document.documentElement.classList.toggle(CLASS_NAME, storedHighContrast());
}
