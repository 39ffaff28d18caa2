// <BudgetTable ex="unc-chain" /> lays out a lesson example's uncertainty budget as a table, one row per
// input of the chain, every number from lib/grader's uncertaintyBudget (server-rendered, no client code).
import { uncertaintyBudget, type BudgetRow } from "@/lib/grader";
import { getExample } from "@/lib/lessons/examples";
import { formatAuto } from "@/lib/lessons/format";

const SI_TEXT: Record<string, string> = { V: "V", ohm: "Ω", K: "K", A: "A" };
const C_UNIT: Record<BudgetRow["sensitivityUnit"], string> = { "A/V": "A/V", "A/ohm": "A/Ω", "A/K": "A/K", A: "A", "A/A": "A/A" };

/** A bound or a standard uncertainty in its input's unit; relative inputs as a percentage. */
function inUnit(value: number, unit: string): string {
  if (unit === "") return `${Number((100 * value).toPrecision(4))} %`;
  return formatAuto(value, SI_TEXT[unit] ?? unit);
}

/** A sensitivity coefficient: the current part gets its prefix ("−25.00 µA/K"). */
function coefficient(value: number, unit: string): string {
  return `${formatAuto(value, "A")}${unit.slice(1)}`;
}

export function BudgetTable({ ex }: { ex: string }) {
  const example = getExample(ex);
  if (example.kind !== "template" || example.template !== "uncertainty") throw new Error(`example "${ex}" is not an uncertainty budget`);
  const b = uncertaintyBudget({ ...example.params });
  const k = Number(example.params.coverageFactor);
  const total = b.combined ** 2;
  return (
    <figure className="my-5 overflow-x-auto break-inside-avoid" data-testid="budget-table">
      <table className="w-full border-collapse text-sm tabular-nums">
        <caption className="mb-2 text-left text-ink-soft">
          Uncertainty budget of I = {formatAuto(b.current, "A")}: each bound as a standard uncertainty, times its sensitivity coefficient
        </caption>
        <thead>
          <tr className="border-b border-ink/30 text-left">
            <th scope="col" className="py-1 pr-3">Source</th>
            <th scope="col" className="py-1 pr-3">Bound or step</th>
            <th scope="col" className="py-1 pr-3">Distribution</th>
            <th scope="col" className="py-1 pr-3">u(xᵢ)</th>
            <th scope="col" className="py-1 pr-3">cᵢ = ∂I/∂xᵢ</th>
            <th scope="col" className="py-1 pr-3">uᵢ(I) = |cᵢ|·u(xᵢ)</th>
            <th scope="col" className="py-1">Share of u_c²</th>
          </tr>
        </thead>
        <tbody>
          {b.rows.filter((row) => row.contribution > 0).map((row) => (
            <tr key={row.key} className={`border-b border-ink/10 ${row.key === b.dominant ? "font-semibold" : ""}`} data-row={row.key}>
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                {row.key}
                {row.key === b.dominant ? " (dominant)" : ""}
              </th>
              <td className="py-1 pr-3">{row.bound === 0 ? "—" : inUnit(row.bound, row.unit)}</td>
              <td className="py-1 pr-3">{row.distribution}</td>
              <td className="py-1 pr-3">{inUnit(row.standard, row.unit)}</td>
              <td className="py-1 pr-3">{coefficient(row.sensitivity, C_UNIT[row.sensitivityUnit])}</td>
              <td className="py-1 pr-3">{formatAuto(row.contribution, "A")}</td>
              <td className="py-1">{`${Number(((100 * row.contribution ** 2) / total).toPrecision(3))} %`}</td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr className="border-t border-ink/30">
            <th scope="row" colSpan={5} className="py-1 pr-3 text-left">
              Combined standard uncertainty u_c = √Σ uᵢ²
            </th>
            <td className="py-1 pr-3 font-semibold" data-testid="budget-combined">{formatAuto(b.combined, "A")}</td>
            <td className="py-1">{`${Number((100 * b.relCombined).toPrecision(4))} % of I`}</td>
          </tr>
          <tr>
            <th scope="row" colSpan={5} className="py-1 pr-3 text-left">
              Expanded uncertainty U = k·u_c, k = {k}
            </th>
            <td className="py-1 pr-3 font-semibold" data-testid="budget-expanded">{formatAuto(b.expanded, "A")}</td>
            <td className="py-1" />
          </tr>
        </tfoot>
      </table>
    </figure>
  );
}
