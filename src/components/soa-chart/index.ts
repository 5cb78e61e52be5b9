export { durationName } from "./chart-model";
export { SoaChart } from "./soa-chart";
export { TransferChart, type TransferChartCurve } from "./transfer-chart";
export type {
  ChartCurve,
  ChartDerated,
  ChartDuration,
  ChartFinding,
  ChartInterpolated,
  ChartPulse,
  SoaChartProps,
} from "./types";
export { ZthChart } from "./zth-chart";
