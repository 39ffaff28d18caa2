// An instrument's range table as the handout and the course's instruments page show it: full scale, shunt
// or burden (or feedback resistor), resolution and accuracy per range.
import { formatAuto } from "@/lib/lessons/format";
import { rangeTable, type InstrumentProfile } from "@/lib/instruments/profile";

export function RangeTable({ profile, caption }: { profile: InstrumentProfile; caption?: string }) {
  const rows = rangeTable(profile);
  return (
    <div className="overflow-x-auto">
      <table className="mt-2 w-full min-w-[34rem] text-sm">
        {caption ? <caption className="text-left text-ink-soft">{caption}</caption> : null}
        <thead>
          <tr className="text-left">
            <th scope="col">Range</th>
            <th scope="col">{profile.kind === "feedback-ammeter" ? "Feedback resistor" : "Shunt / input resistance"}</th>
            <th scope="col">Burden at full scale</th>
            <th scope="col">Resolution</th>
            <th scope="col">Accuracy</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => {
            const range = profile.ranges[i];
            const ohms = profile.kind === "feedback-ammeter" ? range.feedbackOhms : r.inputOhms;
            return (
              <tr key={r.key} className="border-t border-ink/15">
                <th scope="row" className="text-left font-normal">
                  {r.label}
                </th>
                <td>{ohms === undefined ? "—" : formatAuto(ohms, "Ω")}</td>
                <td>{formatAuto(r.burdenAtFullScale, "V")}</td>
                <td>
                  {formatAuto(r.resolution, "A")} <span className="text-ink-soft">({r.resolutionText})</span>
                </td>
                <td>{r.accuracyText}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {profile.autoRange || profile.offset ? (
        <p className="mt-1 text-sm text-ink-soft">
          {profile.autoRange
            ? `Auto-ranging: up above ${profile.autoRange.upAtFractionOfFullScale} of full scale, down below ${profile.autoRange.downAtFractionOfFullScale} of it. `
            : ""}
          {profile.offset ? `Currents both ways around a ${profile.offset.volts} V offset.` : ""}
        </p>
      ) : null}
    </div>
  );
}
