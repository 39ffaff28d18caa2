export { TracePlot, type TraceSummary } from "./TracePlot";
