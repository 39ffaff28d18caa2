// Reading a roster CSV and marking its rows. Expected marks are written by hand from the file's lines.
import { describe, expect, it } from "vitest";
import { checkBenchRoom, classifyRows, readRosterCsv } from "@/lib/courses/roster-csv";

describe("readRosterCsv", () => {
  it("reads a header row in any column order and keeps the file's line numbers", () => {
    const csv = "Section,E-mail,Name\r\nB2,ada@college.example,Ada Example\r\n\r\nB3,\"bo@college.example\",\"Bo, Junior\"\r\n";
    expect(readRosterCsv(csv)).toEqual([
      { line: 2, name: "Ada Example", email: "ada@college.example", section: "B2", bench: "" },
      { line: 4, name: "Bo, Junior", email: "bo@college.example", section: "B3", bench: "" },
    ]);
  });

  it("reads name, e-mail, section by position when there is no header, and semicolons as separators", () => {
    expect(readRosterCsv("Ada Example;ada@college.example;B2\nBo Example;bo@college.example")).toEqual([
      { line: 1, name: "Ada Example", email: "ada@college.example", section: "B2", bench: "" },
      { line: 2, name: "Bo Example", email: "bo@college.example", section: "", bench: "" },
    ]);
  });
});

describe("the optional bench column", () => {
  it("reads a bench column by its header, or as the fourth column without one", () => {
    expect(readRosterCsv("email,name,Bench\nada@college.example,Ada Example,Bench 07\n").map((e) => e.bench)).toEqual(["Bench 07"]);
    expect(readRosterCsv("Ada Example,ada@college.example,A,Bench 03").map((e) => [e.section, e.bench])).toEqual([["A", "Bench 03"]]);
  });

  it("refuses a fifth student at a bench, counting who already sits there", () => {
    const entries = readRosterCsv(["name,email,bench", "A One,a1@college.example,Bench 01", "A Two,a2@college.example,Bench 01", "A Three,a3@college.example,Bench 01", "B One,b1@college.example,Bench 02"].join("\n"));
    const rows = checkBenchRoom(classifyRows(entries, new Map()), new Map([["Bench 01", 2]]), () => true);
    expect(rows.map((r) => r.outcome)).toEqual(["invite", "invite", "bad_row", "invite"]);
    expect(rows[2].message).toBe("Bench 01 would seat more than 4 students.");
  });

  it("marks a bench name with a control character or over 40 characters as a bad row", () => {
    const rows = classifyRows(readRosterCsv(`A,a@college.example,A,"Bench\u000701"\nB,b@college.example,A,${"x".repeat(41)}`), new Map());
    expect(rows.map((r) => r.outcome)).toEqual(["bad_row", "bad_row"]);
  });
});

describe("classifyRows", () => {
  it("marks new, existing, member, bad e-mail, duplicate and nameless rows", () => {
    const entries = readRosterCsv(
      [
        "name,email,section",
        "New One,new.one@college.example,A",
        "Known Two,KNOWN.two@college.example,A",
        "Member Three,member.three@college.example,B",
        "Broken Four,not-an-address,B",
        "New One Again,New.One@college.example,C",
        ",nameless@college.example,C",
      ].join("\n"),
    );
    const accounts = new Map([
      ["known.two@college.example", { id: "u2", role: null }],
      ["member.three@college.example", { id: "u3", role: "student" as const }],
    ]);
    const rows = classifyRows(entries, accounts);
    expect(rows.map((r) => [r.line, r.email, r.outcome])).toEqual([
      [2, "new.one@college.example", "invite"],
      [3, "known.two@college.example", "add"],
      [4, "member.three@college.example", "member"],
      [5, "not-an-address", "bad_email"],
      [6, "new.one@college.example", "duplicate"],
      [7, "nameless@college.example", "bad_row"],
    ]);
    expect(rows[4].message).toBe("The same address is on line 2.");
    expect(rows[2].message).toBe("Already in the course as a student.");
    expect(rows[0].section).toBe("A");
  });
});
