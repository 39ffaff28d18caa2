// The lab builder's pure form model: defaults per template, units read as the grader reads them,
// the body it sends passes labInputSchema, API error paths land on the right fields, PATCH sends only changes.
import { describe, expect, it } from "vitest";
import { defaultVariantSpec, drawVariant, templates, TEMPLATE_KEYS } from "@/lib/grader";
import { labInputSchema } from "@/lib/validation/labs";
import {
  builderSchema,
  changedFields,
  changesGrades,
  checkForm,
  emptyForm,
  formPathFor,
  formToInput,
  inputToForm,
  mapServerErrors,
  readAsText,
  readValue,
  specToForm,
  splitList,
  templateDefaults,
  valueText,
} from "@/components/labs/builder/form-model";
import { fromLocalInput, toLocalInput } from "@/lib/dates";
import { labState } from "@/lib/labs/schedule";

function filled(templateKey = "shunt-burden" as (typeof TEMPLATE_KEYS)[number]) {
  return { ...emptyForm(templateKey), title: "Burden on the bench" };
}

describe("template defaults", () => {
  it.each(TEMPLATE_KEYS)("%s: the default form reads back into the template's default spec and passes labInputSchema", (key) => {
    const form = filled(key);
    const { input, errors } = checkForm(form);
    expect(errors).toEqual({});
    expect(input.spec).toEqual(defaultVariantSpec(key));
    expect(input.questions).toHaveLength(templates[key].quantities.length);
    expect(labInputSchema.safeParse(input).success).toBe(true);
  });

  it("a template change resets parameters and questions to the new template's", () => {
    const d = templateDefaults("duty-cycle");
    expect(Object.keys(d.parameters)).toEqual(templates["duty-cycle"].parameters.map((p) => p.key));
    expect(d.questions.map((q) => q.quantity)).toEqual(["averageCurrent", "chargePerWake", "batteryLife"]);
    expect(d.parameters.batteryCapacity).toMatchObject({ mode: "range", min: "100 mAh", max: "2000 mAh" });
  });
});

describe("values with units", () => {
  const rl = templates["shunt-burden"].parameters.find((p) => p.key === "loadResistance")!;
  const vs = templates["shunt-burden"].parameters.find((p) => p.key === "supplyVoltage")!;
  const bits = templates["range-resolution"].parameters.find((p) => p.key === "adcBits")!;

  it("reads values as the grader does and says how they were read", () => {
    const r = readValue("4k7", rl);
    expect(r).toEqual({ ok: true, value: 4700 });
    expect(readAsText(4700, rl)).toBe("4.7 kΩ");
    expect(readValue("3.3 V", vs)).toEqual({ ok: true, value: 3.3 });
    expect(readValue("12", bits)).toEqual({ ok: true, value: 12 });
  });

  it("refuses a wrong dimension, a bare number and a fractional integer with a message", () => {
    const wrong = readValue("3 mA", vs);
    expect(wrong.ok).toBe(false);
    expect(!wrong.ok && wrong.message).toMatch(/voltage/);
    expect(readValue("5", vs).ok).toBe(false);
    expect(readValue("12.5", bits)).toEqual({ ok: false, message: "Enter a whole number." });
    expect(readValue("", vs)).toEqual({ ok: false, message: "Enter a value." });
  });

  it("writes values as text that reads back exactly", () => {
    for (const key of TEMPLATE_KEYS) {
      for (const p of templates[key].parameters) {
        if (typeof p.default !== "number") continue;
        const r = readValue(valueText(p.default, p), p);
        expect(r, `${key}.${p.key}`).toEqual({ ok: true, value: p.default });
      }
    }
    expect(valueText(792, templates["duty-cycle"].parameters.find((p) => p.key === "batteryCapacity")!)).toBe("220 mAh");
  });

  it("splits lists at semicolons and new lines, keeping decimal commas", () => {
    expect(splitList("1 kΩ; 2,2 kΩ\n4.7 kΩ;;")).toEqual(["1 kΩ", "2,2 kΩ", "4.7 kΩ"]);
  });
});

describe("form → API body", () => {
  it("turns ranges, lists, steps, series and tolerances into the spec", () => {
    const form = filled();
    form.parameters.supplyVoltage = { ...form.parameters.supplyVoltage, mode: "range", min: "2 V", max: "3000 mV", step: "0.5 V" };
    form.parameters.loadResistance = { ...form.parameters.loadResistance, mode: "list", values: "1 kΩ; 2k2; 4.7 kΩ", series: "E12", tolerancePercent: "5" };
    form.parameters.shuntResistance = { ...form.parameters.shuntResistance, mode: "fixed", value: "10 Ω", tolerancePercent: "0.1 %" };
    form.questions = [
      { quantity: "burdenVoltage", kind: "bench", points: "2", tolerancePercent: "3" },
      { quantity: "trueCurrent", kind: "prediction", points: "1", tolerancePercent: "" },
    ];
    form.opensAt = "2026-12-10T09:00";
    form.dueAt = "2026-12-17T17:30";
    const { input, errors } = checkForm(form);
    expect(errors).toEqual({});
    expect(input.spec.parameters).toEqual({
      supplyVoltage: { mode: "range", min: 2, max: 3, step: 0.5 },
      loadResistance: { mode: "list", values: [1000, 2200, 4700], series: "E12", tolerancePercent: 5 },
      shuntResistance: { mode: "fixed", value: 10, series: "E24", tolerancePercent: 0.1 },
    });
    expect(input.questions).toEqual([
      { quantity: "burdenVoltage", kind: "bench", points: 2, tolerancePercent: 3 },
      { quantity: "trueCurrent", kind: "prediction", points: 1 },
    ]);
    expect(input.opensAt).toBe(new Date("2026-12-10T09:00").toISOString());
    const parsed = labInputSchema.parse(input);
    expect(parsed.dueAt!.getTime()).toBe(new Date("2026-12-17T17:30").getTime());
    // the spec really draws
    const params = drawVariant(parsed.spec, "preview:1");
    expect([1000, 2200, 4700]).toContain(params.loadResistance);
    expect([2, 2.5, 3]).toContain(params.supplyVoltage);
  });

  it("reports unreadable values under their own field, not the schema's generic message", () => {
    const form = filled();
    form.parameters.supplyVoltage = { ...form.parameters.supplyVoltage, mode: "range", min: "2 mA", max: "5 V" };
    form.parameters.loadResistance = { ...form.parameters.loadResistance, mode: "list", values: "1 kΩ; banana" };
    form.questions[0].points = "";
    const { errors } = checkForm(form);
    expect(errors["parameters.supplyVoltage.min"]).toMatch(/current/);
    expect(errors["parameters.loadResistance.values"]).toMatch(/^"banana"/);
    expect(errors["questions.0.points"]).toBe("Enter 0 or more points.");
    expect(Object.keys(errors).some((k) => k.endsWith(".mode"))).toBe(false);
  });

  it("reports the schema's own errors at the form's paths", () => {
    const form = filled();
    form.title = " ";
    form.opensAt = "2026-12-10T09:00";
    form.dueAt = "2026-12-09T09:00";
    form.attemptsAllowed = "0";
    form.questions = [];
    const { errors } = checkForm(form);
    expect(errors.title).toBe("Give the lab a title.");
    expect(errors.dueAt).toBe("The due date must come after the opening date.");
    expect(errors.attemptsAllowed).toBe("Allow at least one attempt.");
    expect(errors["root.questions"]).toBe("Ask at least one question.");
  });

  it("a range that cannot be snapped to its series is refused for the whole spec", () => {
    const form = filled();
    form.parameters.loadResistance = { ...form.parameters.loadResistance, mode: "range", min: "1.01 kΩ", max: "1.05 kΩ", series: "E6" };
    const { errors } = checkForm(form);
    expect(errors["root.spec"]).toMatch(/never give a circuit/);
  });

  it("the react-hook-form schema outputs the API body or issues at form paths", () => {
    const schema = builderSchema();
    const ok = schema.safeParse(filled());
    expect(ok.success).toBe(true);
    expect(ok.success && labInputSchema.safeParse(ok.data).success).toBe(true);
    const bad = schema.safeParse({ ...filled(), title: "" });
    expect(bad.success).toBe(false);
    expect(!bad.success && bad.error.issues.map((i) => i.path.join("."))).toEqual(["title"]);
  });
});

describe("API error paths → form fields", () => {
  it.each([
    ["questions.0.quantity", "questions.0.quantity"],
    ["questions.2", "questions.2.quantity"],
    ["questions", "root.questions"],
    ["spec.parameters.loadResistance", "parameters.loadResistance.mode"],
    ["spec.parameters.loadResistance.min", "parameters.loadResistance.min"],
    ["spec.parameters.loadResistance.values.1", "parameters.loadResistance.values"],
    ["spec", "root.spec"],
    ["spec.template", "root.spec"],
    ["dueAt", "dueAt"],
    ["templateKey", "templateKey"],
    ["policy.relativeTolerance", "defaultTolerancePercent"],
    ["status", "root.server"],
  ])("%s → %s", (api, form) => {
    expect(formPathFor(api)).toBe(form);
  });

  it("keeps the first message per field", () => {
    expect(mapServerErrors({ dueAt: ["A", "B"], "spec.parameters.x": ["C"], "spec.parameters.x.mode": ["D"] })).toEqual({
      dueAt: "A",
      "parameters.x.mode": "C",
    });
  });
});

describe("editing a stored lab", () => {
  const stored = {
    title: "Stored lab",
    templateKey: "shunt-burden" as const,
    // key order as PostgreSQL's jsonb returns it, and no series named
    spec: { template: "shunt-burden" as const, parameters: { loadResistance: { max: 10000, min: 100, mode: "range" as const, tolerancePercent: 1 }, supplyVoltage: { mode: "fixed" as const, value: 3.3 } } },
    questions: [{ id: "q1", points: 2, kind: "prediction" as const, quantity: "trueCurrent" }],
    policy: {},
    attemptsAllowed: 2,
    counting: "last" as const,
    opensAt: "2026-12-01T08:00:00.000Z",
    dueAt: null,
    latePenaltyPercentPerDay: 5,
    lateFloorPercent: 40,
    showExpected: "after_due" as const,
    instructions: "Do it.",
    safetyNotes: "",
  };

  it("round-trips into the form and back without spurious changes", () => {
    const form = inputToForm(stored);
    expect(form.questions[0]).toEqual({ id: "q1", quantity: "trueCurrent", kind: "prediction", points: "2", tolerancePercent: "" });
    expect(form.opensAt).toBe(toLocalInput("2026-12-01T08:00:00.000Z"));
    const before = formToInput(inputToForm(stored)).input;
    const after = formToInput({ ...inputToForm(stored) }).input;
    expect(changedFields(before, after)).toEqual({});
  });

  it("sends only what changed, and knows which changes recompute grades", () => {
    const before = formToInput(inputToForm(stored)).input;
    const form = inputToForm(stored);
    form.title = "Renamed";
    let patch = changedFields(before, formToInput(form).input);
    expect(patch).toEqual({ title: "Renamed" });
    expect(changesGrades(patch)).toBe(false);
    form.parameters.loadResistance.max = "22 kΩ";
    patch = changedFields(before, formToInput(form).input);
    expect(Object.keys(patch).sort()).toEqual(["spec", "title"]);
    expect(changesGrades(patch)).toBe(true);
  });

  it("keeps the spec's parameters it cannot show the same (series default E24)", () => {
    const form = specToForm(stored.spec);
    expect(form.loadResistance.series).toBe("E24");
    expect(form.shuntResistance.mode).toBe("fixed");
  });

  it("dates: local text ↔ ISO instants", () => {
    expect(fromLocalInput("")).toBeNull();
    expect(fromLocalInput("nonsense")).toBe("nonsense");
    const iso = fromLocalInput("2026-12-10T09:15")!;
    expect(toLocalInput(iso)).toBe("2026-12-10T09:15");
  });
});

describe("lab state for the list", () => {
  const now = new Date("2026-12-10T12:00:00Z");
  it("is upcoming, open, taking late attempts, or closed only once no attempt is accepted", () => {
    expect(labState({ opensAt: "2026-12-11T00:00:00Z", dueAt: null, closesAt: null }, now)).toBe("upcoming");
    expect(labState({ opensAt: null, dueAt: null, closesAt: null }, now)).toBe("open");
    expect(labState({ opensAt: new Date("2026-12-01T00:00:00Z"), dueAt: new Date("2026-12-20T00:00:00Z"), closesAt: new Date("2026-12-25T00:00:00Z") }, now)).toBe("open");
    // past the due date but before the close: late attempts are still accepted, so not "closed"
    expect(labState({ opensAt: null, dueAt: "2026-12-09T00:00:00Z", closesAt: "2026-12-14T00:00:00Z" }, now)).toBe("late");
    expect(labState({ opensAt: null, dueAt: "2026-12-04T00:00:00Z", closesAt: "2026-12-09T00:00:00Z" }, now)).toBe("closed");
  });
});
