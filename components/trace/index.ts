export { TracePlot, type TracePlotData } from "./TracePlot";
