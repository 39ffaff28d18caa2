// Lab rules around the grader: late days, the late penalty with its floor, which attempt counts, and
// when expected values may be shown. Expected numbers are worked out by hand in each case.
import { describe, expect, it } from "vitest";
import { applyPenalty, countingAttempt, expectedVisible, isOpen, latePenaltyPercent, lateDays } from "@/lib/labs/policy";

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
  it("expected values show after each attempt, after the due date, or never", () => {
    const before = at("2027-02-28T00:00:00Z");
    const after = at("2027-03-02T00:00:00Z");
    expect(expectedVisible({ showExpected: "after_attempt", dueAt: due }, before)).toBe(true);
    expect(expectedVisible({ showExpected: "after_due", dueAt: due }, before)).toBe(false);
    expect(expectedVisible({ showExpected: "after_due", dueAt: due }, after)).toBe(true);
    expect(expectedVisible({ showExpected: "never", dueAt: due }, after)).toBe(false);
  });
});
