// npm run bench — prints the engine timings (no assertions; numbers depend on the machine).
import { formatTimings, runEngineBench } from "./engine";

console.log(formatTimings(runEngineBench()));
