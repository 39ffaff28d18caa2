// The lab builder's form model, split by concern: the form's types (form-types.ts), values as text
// (form-text.ts), defaults and stored labs as form state (form-defaults.ts), the form as the API's body
// (form-input.ts), checking and the API's error paths (form-errors.ts). What changed and whether it
// touches grades is shared with the server in lib/labs/changes.ts. Pure: the client form and the unit
// tests share all of it.
export * from "./form-types";
export * from "./form-text";
export * from "./form-defaults";
export * from "./form-input";
export * from "./form-errors";
export { changedFields, changesGrades, GRADING_FIELDS, sameValue } from "@/lib/labs/changes";
