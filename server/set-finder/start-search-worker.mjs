// Worker threads on Node 20 ignore `--import tsx` in execArgv, so the worker registers tsx itself before loading the TypeScript search worker.
import { register } from "tsx/esm/api";

register();
await import("./search-worker.ts");
