import type { UploadProgress } from "../../../lib/upload-with-progress";

/** What the plan upload form says while a drawing goes up: how much is sent, then that the server is at work. */
export function uploadStatusText(progress: UploadProgress): string {
  if (progress.stage === "processing") return "Uploaded. Checking and preparing the drawing…";
  if (progress.fraction === null) return "Uploading the drawing…";
  const percent = Math.min(100, Math.max(0, Math.floor(progress.fraction * 100)));
  return `Uploading the drawing… ${percent} %`;
}
