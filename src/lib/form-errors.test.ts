import { afterEach, describe, expect, it } from "vitest";
import { ApiRequestError } from "./api-client";
import { fieldErrorSummary, fieldLabel, formErrorMessage } from "./form-errors";

afterEach(() => {
  document.body.innerHTML = "";
});

describe("forms say which field and why", () => {
  it("names a refused field by its label on the page", () => {
    document.body.innerHTML = `<label for="tz">Time zone</label><input id="tz" name="timeZone" />`;
    expect(fieldErrorSummary({ timeZone: "is not a time zone" })).toBe("Please correct: Time zone is not a time zone.");
  });

  it("puts a field that is not on the form into words", () => {
    expect(fieldLabel("findingId")).toBe("Finding id");
    expect(fieldLabel("levels.2.fromPpm")).toBe("Levels 3 from ppm");
    expect(fieldLabel("currentPassword")).toBe("Current password");
  });

  it("lists every refused field of a failed request, and passes other errors through", () => {
    const refused = new ApiRequestError(400, "validation_failed", "Some fields need attention.", {
      fullCharge: "must be more than 0",
      refrigerantId: "is not in the refrigerant catalogue",
    });
    expect(formErrorMessage(refused)).toBe(
      "Please correct: Full charge must be more than 0. Refrigerant id is not in the refrigerant catalogue.",
    );
    expect(formErrorMessage(new ApiRequestError(409, "conflict", "Someone else saved first."))).toBe(
      "Someone else saved first.",
    );
    expect(formErrorMessage(null)).toBeNull();
  });
});
