export { TracePlot, type PlottedTrace } from "./TracePlot";
