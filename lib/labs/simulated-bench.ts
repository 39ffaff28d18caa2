// The simulated bench of a lab on the server: whose bench (the caller's, or for staff a student's), its seed,
// the lab's instrument and the student's circuit; the readings replayed with the same pure module the browser
// runs (lib/simulation). A read: the circuit is the stored one, or drawn with the same seed without storing.
import "server-only";
import { db } from "@/db";
import { findMembership } from "@/db/queries/courses";
import { findVariant } from "@/db/queries/labs";
import { isStaff, type CourseAccess } from "@/lib/auth/access";
import { AppError, notFound } from "@/lib/errors";
import { drawVariant, type Params } from "@/lib/grader";
import { teachingMeter } from "@/lib/instruments/library";
import type { InstrumentProfile } from "@/lib/instruments/profile";
import { benchSeed, circuitFor, simulateReadings, type BenchCircuit, type SimReading } from "@/lib/simulation";
import type { BenchReadingsQuery } from "@/lib/validation/bench";
import type { Lab } from "./grading";

export interface Bench {
  seed: string;
  instrument: InstrumentProfile;
  circuit: BenchCircuit;
}

/** The lab's instrument: the course teaching meter until labs name their own. */
export function labInstrument(lab: Lab): InstrumentProfile {
  void lab;
  const { libraryKey, ...profile } = teachingMeter;
  void libraryKey;
  return profile;
}

/** Whose bench the caller may open: their own; staff also any student's of the course (anyone else: 404). */
async function holderOf(access: CourseAccess, lab: Lab, userId: string | undefined): Promise<string> {
  if (userId === undefined || userId === access.user.id) return access.user.id;
  if (!isStaff(access.role)) throw notFound("That student's bench");
  const member = await findMembership(db, lab.courseId, userId);
  if (!member || member.role !== "student") throw notFound("That student's bench");
  return userId;
}

export async function benchFor(lab: Lab, access: CourseAccess, userId?: string): Promise<Bench> {
  if (lab.bench === "real") throw notFound("A simulated bench for this lab");
  const holder = await holderOf(access, lab, userId);
  const stored = await findVariant(db, lab.id, holder);
  // the same seed as lib/labs/attempts.ts variantFor: the values the handout shows once drawn
  const params = stored ? (stored.params as Params) : drawVariant(lab.spec, `${lab.id}:${holder}`);
  const circuit = circuitFor(lab.templateKey, params);
  if (!circuit) throw notFound("A simulated bench for this lab");
  const instrument = labInstrument(lab);
  return { seed: benchSeed(lab.id, holder, instrument.name), instrument, circuit };
}

export async function benchReadings(lab: Lab, access: CourseAccess, q: BenchReadingsQuery): Promise<SimReading[]> {
  const bench = await benchFor(lab, access, q.userId);
  const { instrument } = bench;
  if (q.range === "auto" ? !instrument.autoRange : !instrument.ranges.some((r) => r.key === q.range)) {
    const keys = [...instrument.ranges.map((r) => r.key), ...(instrument.autoRange ? ["auto"] : [])];
    throw new AppError("bad_request", `The instrument has no range "${q.range}".`, { range: [`Choose one of ${keys.join(", ")}.`] });
  }
  return simulateReadings(bench.seed, instrument, bench.circuit, { range: q.range, filter: q.filter === "on", from: q.from, count: q.count, rate: q.rate });
}
