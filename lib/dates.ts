// Dates as the app shows and reads them, for the server and the browser alike: one fixed UTC wording,
// and the text of a datetime-local input (in the time zone of whoever runs the code, the browser's).

/** A date as the server and the browser both show it: "12 Mar 2027, 17:00 UTC". */
export function utcDate(d: Date | string | null | undefined): string {
  if (!d) return "";
  const date = typeof d === "string" ? new Date(d) : d;
  if (Number.isNaN(date.getTime())) return "";
  const text = new Intl.DateTimeFormat("en-GB", { timeZone: "UTC", day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", hourCycle: "h23" }).format(date);
  return `${text} UTC`;
}

function pad(n: number): string {
  return String(n).padStart(2, "0");
}

/** An ISO instant as datetime-local text in the time zone of whoever runs this (the browser). */
export function toLocalInput(iso: string | Date | null | undefined): string {
  if (!iso) return "";
  const d = iso instanceof Date ? iso : new Date(iso);
  if (Number.isNaN(d.getTime())) return "";
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** datetime-local text (local time) as an ISO instant; "" → null; unreadable → the text itself, for the schema to refuse. */
export function fromLocalInput(text: string): string | null {
  if (!text.trim()) return null;
  const d = new Date(text);
  return Number.isNaN(d.getTime()) ? text : d.toISOString();
}

