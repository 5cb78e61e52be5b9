export { durationName } from "./chart-model";
export { SoaChart } from "./soa-chart";
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
