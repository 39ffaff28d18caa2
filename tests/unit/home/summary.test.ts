// What a student's course home says is next. Expected values are worked out by hand from the dates below.
import { describe, expect, it } from "vitest";
import { studentSummary, timeLeft, type HomeLab } from "@/lib/courses/home-summary";

const now = new Date("2027-03-10T12:00:00Z");
const at = (iso: string) => new Date(iso);
const lab = (id: string, over: Partial<HomeLab>): HomeLab => ({ id, title: id, opensAt: null, dueAt: null, attemptsAllowed: 2, counting: "best", maxPoints: 10, ...over });

describe("studentSummary", () => {
  const labs = [
    lab("past", { opensAt: at("2027-02-01T00:00:00Z"), dueAt: at("2027-03-01T00:00:00Z") }),
    lab("late-open", { opensAt: at("2027-02-01T00:00:00Z"), dueAt: at("2027-03-05T00:00:00Z"), attemptsAllowed: 3 }),
    lab("soon-used-up", { opensAt: at("2027-03-01T00:00:00Z"), dueAt: at("2027-03-11T00:00:00Z"), attemptsAllowed: 1 }),
    lab("next", { opensAt: at("2027-03-05T00:00:00Z"), dueAt: at("2027-03-12T15:30:00Z"), attemptsAllowed: 3, counting: "last" }),
    lab("open-no-due", {}),
    lab("later", { opensAt: at("2027-04-01T00:00:00Z"), dueAt: at("2027-04-10T00:00:00Z") }),
  ];
  const attempts = [
    { id: "a1", labId: "soon-used-up", number: 1, score: 7, maxScore: 10 },
    { id: "a2", labId: "next", number: 1, score: 9, maxScore: 10 },
    { id: "a3", labId: "next", number: 2, score: 4, maxScore: 10 },
    { id: "a4", labId: "past", number: 1, score: 6, maxScore: 10 },
    { id: "a5", labId: "past", number: 2, score: 8, maxScore: 10 },
  ];
  const s = studentSummary(labs, attempts, now);

  it("the next lab due is the soonest open one ahead with attempts left, with the time left", () => {
    expect(s.nextDue?.lab.id).toBe("next");
    // 12:00 on the 10th to 15:30 on the 12th: 2 days 3 h 30 min
    expect(s.nextDue?.msLeft).toBe((2 * 24 + 3.5) * 3600_000);
    expect(s.nextDue?.attemptsLeft).toBe(1);
  });

  it("lists open labs with attempts left, soonest due first (a past-due one too), not used-up or unopened ones", () => {
    expect(s.open.map((o) => [o.lab.id, o.attemptsLeft])).toEqual([
      ["late-open", 3],
      ["next", 1],
      ["open-no-due", 2],
    ]);
    expect(s.upcoming.map((l) => l.id)).toEqual(["later"]);
  });

  it("counts the best or the last attempt per lab, as the lab says", () => {
    expect(Object.fromEntries(s.standings.map((x) => [x.lab.id, x.counted?.score ?? null]))).toEqual({
      past: 8, // best of 6 and 8
      "late-open": null,
      "soon-used-up": 7,
      next: 4, // last of 9 then 4
      "open-no-due": null,
    });
  });

  it("has nothing due when every open lab is used up or past due", () => {
    expect(studentSummary([labs[0], labs[2]], attempts, now).nextDue).toBeNull();
  });
});

describe("timeLeft", () => {
  it("says the two largest units", () => {
    expect(timeLeft((2 * 24 + 3.5) * 3600_000)).toBe("2 days 3 hours");
    expect(timeLeft(24 * 3600_000)).toBe("1 day");
    expect(timeLeft(90 * 60_000)).toBe("1 hour 30 minutes");
    expect(timeLeft(59 * 60_000 + 59_000)).toBe("59 minutes");
    expect(timeLeft(30_000)).toBe("less than a minute");
  });
});
