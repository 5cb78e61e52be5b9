// Benchmarks for the SOA engine: figures are printed, never asserted.
// Run with `npm run bench`. Each section lives in scripts/bench/.

import { runMatrixBench } from "./bench/matrix";
import { runThermalBench } from "./bench/thermal";

runThermalBench();
runMatrixBench();
