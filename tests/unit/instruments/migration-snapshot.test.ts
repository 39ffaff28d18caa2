// The migration that gives every course the teaching meter stores a frozen copy of it; on the day it was
// written that copy is the built-in profile.
import { describe, expect, it } from "vitest";
import { TEACHING_METER_SNAPSHOT } from "../../../migrations/2026-12-05T2320_instruments";
import { copyOfLibrary } from "../../../lib/instruments/library";
import { instrumentProfileSchema } from "../../../lib/validation/instruments";

describe("the teaching meter every course starts with", () => {
  it("is the built-in teaching meter", () => {
    expect(TEACHING_METER_SNAPSHOT).toEqual(copyOfLibrary("teaching-meter"));
  });
  it("passes the profile schema, as every built-in profile does", () => {
    expect(instrumentProfileSchema.safeParse(TEACHING_METER_SNAPSHOT).success).toBe(true);
    for (const key of ["handheld-multimeter", "bench-multimeter", "feedback-ammeter"]) {
      const r = instrumentProfileSchema.safeParse(copyOfLibrary(key));
      expect(r.success ? [] : r.error.issues, key).toEqual([]);
    }
  });
});
