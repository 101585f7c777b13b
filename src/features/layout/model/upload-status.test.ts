import { describe, expect, it } from "vitest";
import { uploadStatusText } from "./upload-status";

describe("the plan upload's status", () => {
  it("says how much of the drawing is sent, rounded down so 100 % means all of it", () => {
    expect(uploadStatusText({ stage: "uploading", fraction: 0 })).toBe("Uploading the drawing… 0 %");
    expect(uploadStatusText({ stage: "uploading", fraction: 0.426 })).toBe("Uploading the drawing… 42 %");
    expect(uploadStatusText({ stage: "uploading", fraction: 0.999 })).toBe("Uploading the drawing… 99 %");
  });
  it("says only that it is uploading when the size is unknown", () => {
    expect(uploadStatusText({ stage: "uploading", fraction: null })).toBe("Uploading the drawing…");
  });
  it("says the server is at work once every byte is sent", () => {
    expect(uploadStatusText({ stage: "processing" })).toBe("Uploaded. Checking and preparing the drawing…");
  });
});
