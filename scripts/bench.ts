// Benchmarks for the SOA engine and the capture pipeline: figures are printed, never asserted.
// Run with `npm run bench`. Each section lives in scripts/bench/.

import { runCaptureBench } from "./bench/capture";
import { runCaptureCheckBench } from "./bench/capture-check";
import { runMatrixBench } from "./bench/matrix";
import { runProjectMatrixBench } from "./bench/project-matrix";
import { runThermalBench } from "./bench/thermal";

runThermalBench();
runCaptureCheckBench();
runMatrixBench();
await runProjectMatrixBench();
await runCaptureBench();
