// Lab rules around the grader: late days, the late penalty with its floor, which attempt counts, and
// when expected values may be shown. Expected numbers are worked out by hand in each case.
import { describe, expect, it } from "vitest";
import { applyPenalty, canStillEarn, closeOf, countingAttempt, expectedVisible, isClosed, isOpen, latePenaltyPercent, lateDays, withException } from "@/lib/labs/policy";

const due = new Date("2027-03-01T12:00:00Z");
const at = (iso: string) => new Date(iso);

describe("late days", () => {
  it("are 0 on time, and any started day counts as a whole day", () => {
    expect(lateDays({ dueAt: due }, at("2027-03-01T12:00:00Z"))).toBe(0);
    expect(lateDays({ dueAt: due }, at("2027-03-01T11:59:59Z"))).toBe(0);
    expect(lateDays({ dueAt: due }, at("2027-03-01T12:00:01Z"))).toBe(1);
    expect(lateDays({ dueAt: due }, at("2027-03-03T12:00:00Z"))).toBe(2);
    expect(lateDays({ dueAt: due }, at("2027-03-03T12:00:01Z"))).toBe(3);
    expect(lateDays({ dueAt: null }, at("2030-01-01T00:00:00Z"))).toBe(0);
  });
});

describe("the late penalty", () => {
  it("grows per day and never takes more than the floor allows", () => {
    const rules = { latePenaltyPercentPerDay: 10, lateFloorPercent: 50 };
    expect(latePenaltyPercent(rules, 0)).toBe(0);
    expect(latePenaltyPercent(rules, 2)).toBe(20);
    expect(latePenaltyPercent(rules, 5)).toBe(50);
    expect(latePenaltyPercent(rules, 9)).toBe(50);
    expect(latePenaltyPercent({ latePenaltyPercentPerDay: 40, lateFloorPercent: 0 }, 3)).toBe(100);
  });

  it("is applied to the raw score", () => {
    expect(applyPenalty(8, 25)).toBe(6);
    expect(applyPenalty(7, 50)).toBe(3.5);
    expect(applyPenalty(10, 0)).toBe(10);
  });
});

describe("the attempt that counts", () => {
  const attempts = [
    { number: 1, score: 6 },
    { number: 2, score: 9 },
    { number: 3, score: 7 },
  ];
  it("is the best score, or the last attempt, as the lab says", () => {
    expect(countingAttempt(attempts, "best")?.number).toBe(2);
    expect(countingAttempt(attempts, "last")?.number).toBe(3);
    expect(countingAttempt([], "best")).toBeUndefined();
  });
  it("on a tie for best, is the later attempt", () => {
    expect(countingAttempt([{ number: 1, score: 5 }, { number: 2, score: 5 }], "best")?.number).toBe(2);
  });
});

describe("opening and expected values", () => {
  it("a lab is open from its opening time", () => {
    expect(isOpen({ opensAt: due }, at("2027-03-01T11:00:00Z"))).toBe(false);
    expect(isOpen({ opensAt: due }, at("2027-03-01T12:00:00Z"))).toBe(true);
    expect(isOpen({ opensAt: null }, at("2000-01-01T00:00:00Z"))).toBe(true);
  });
});

describe("the close and expected values (no expected value while points can still be earned)", () => {
  // 10 % per day with a 50 % floor: the floor is reached after (100 - 50) / 10 = 5 days (hand calculation)
  const rules = { dueAt: due, closesAt: null, latePenaltyPercentPerDay: 10, lateFloorPercent: 50, attemptsAllowed: 3 };
  it("closes by default when the late penalty reaches its floor; an explicit close wins", () => {
    expect(closeOf(rules)?.toISOString()).toBe("2027-03-06T12:00:00.000Z");
    // 30 % per day, floor 0: ceil(100 / 30) = 4 days
    expect(closeOf({ ...rules, latePenaltyPercentPerDay: 30, lateFloorPercent: 0 })?.toISOString()).toBe("2027-03-05T12:00:00.000Z");
    // no late penalty: closes at the due date (late work would score as much as work on time)
    expect(closeOf({ ...rules, latePenaltyPercentPerDay: 0 })?.toISOString()).toBe("2027-03-01T12:00:00.000Z");
    expect(closeOf({ ...rules, closesAt: at("2027-03-02T00:00:00Z") })?.toISOString()).toBe("2027-03-02T00:00:00.000Z");
    expect(closeOf({ ...rules, dueAt: null })).toBeNull();
    expect(isClosed(rules, at("2027-03-06T12:00:00Z"))).toBe(false);
    expect(isClosed(rules, at("2027-03-06T12:00:01Z"))).toBe(true);
    // the last accepted moment is exactly at the floor: 5 days late, 50 % off
    expect(latePenaltyPercent(rules, lateDays(rules, at("2027-03-06T12:00:00Z")))).toBe(50);
  });

  it("points can be earned with attempts left until the close", () => {
    expect(canStillEarn(rules, 2, at("2027-03-03T00:00:00Z"))).toBe(true);
    expect(canStillEarn(rules, 3, at("2027-03-03T00:00:00Z"))).toBe(false);
    expect(canStillEarn(rules, 0, at("2027-03-07T00:00:00Z"))).toBe(false);
  });

  for (const showExpected of ["after_attempt", "after_due"] as const) {
    it(`"${showExpected}": hidden while attempts are left and the lab accepts them, the due date passed included`, () => {
      const r = { ...rules, showExpected };
      expect(expectedVisible(r, 1, at("2027-02-28T00:00:00Z"))).toBe(false);
      // after the due date, late attempts still earn up to half the points: still hidden
      expect(expectedVisible(r, 1, at("2027-03-02T00:00:00Z"))).toBe(false);
      expect(expectedVisible(r, 2, at("2027-03-06T12:00:00Z"))).toBe(false);
      // closed: shown
      expect(expectedVisible(r, 1, at("2027-03-06T12:00:01Z"))).toBe(true);
      // attempts used up after the due date: shown
      expect(expectedVisible(r, 3, at("2027-03-02T00:00:00Z"))).toBe(true);
    });
  }

  it("attempts used up before the due date: shown at once after each attempt, after the due date otherwise", () => {
    const before = at("2027-02-28T00:00:00Z");
    expect(expectedVisible({ ...rules, showExpected: "after_attempt" }, 3, before)).toBe(true);
    expect(expectedVisible({ ...rules, showExpected: "after_due" }, 3, before)).toBe(false);
  });

  it("never means never", () => {
    expect(expectedVisible({ ...rules, showExpected: "never" }, 3, at("2030-01-01T00:00:00Z"))).toBe(false);
  });

  it("a lab without due date or close shows them only after the last attempt", () => {
    const open = { ...rules, dueAt: null, showExpected: "after_attempt" as const };
    expect(expectedVisible(open, 2, at("2030-01-01T00:00:00Z"))).toBe(false);
    expect(expectedVisible(open, 3, at("2030-01-01T00:00:00Z"))).toBe(true);
  });
});

describe("a student's exception (extension and extra attempts)", () => {
  const rules = { dueAt: due, closesAt: at("2027-03-04T12:00:00Z"), attemptsAllowed: 3, latePenaltyPercentPerDay: 10, lateFloorPercent: 50 };
  const ex = (over: Partial<{ dueAt: Date | null; closesAt: Date | null; extraAttempts: number }>) => ({ dueAt: null, closesAt: null, extraAttempts: 0, reason: "Illness, note seen", ...over });

  it("uses the student's own due date: no late day inside the extension, days counted from it after", () => {
    const own = withException(rules, ex({ dueAt: at("2027-03-05T12:00:00Z") }));
    expect(lateDays(own, at("2027-03-04T18:00:00Z"))).toBe(0);
    expect(lateDays(rules, at("2027-03-04T18:00:00Z"))).toBe(4);
    expect(lateDays(own, at("2027-03-05T13:00:00Z"))).toBe(1);
  });

  it("moves an explicit close by as much as the due date moved, unless the exception sets its own", () => {
    expect(withException(rules, ex({ dueAt: at("2027-03-05T12:00:00Z") })).closesAt).toEqual(at("2027-03-08T12:00:00Z"));
    expect(withException(rules, ex({ dueAt: at("2027-03-05T12:00:00Z"), closesAt: at("2027-03-06T00:00:00Z") })).closesAt).toEqual(at("2027-03-06T00:00:00Z"));
    // the default close (none set) follows the new due date: 5 days to the floor at 10 %/day down to 50 %
    expect(closeOf(withException({ ...rules, closesAt: null }, ex({ dueAt: at("2027-03-05T12:00:00Z") })))).toEqual(at("2027-03-10T12:00:00Z"));
  });

  it("adds extra attempts to the lab's, and leaves the rules alone without an exception", () => {
    expect(withException(rules, ex({ extraAttempts: 2 })).attemptsAllowed).toBe(5);
    expect(withException(rules, null)).toBe(rules);
  });
});
