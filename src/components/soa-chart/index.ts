export { durationName } from "./chart-model";
export { InstabilityNote } from "./instability-note";
export { SoaChart } from "./soa-chart";
export { TransferChart, type TransferChartCurve } from "./transfer-chart";
export type {
  ChartCurve,
  ChartDerated,
  ChartDuration,
  ChartFinding,
  ChartInstability,
  ChartInterpolated,
  ChartPulse,
  SoaChartProps,
} from "./types";
export { ZthChart } from "./zth-chart";
