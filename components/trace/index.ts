export { TracePlot, type PlottedTrace } from "./trace-plot";
