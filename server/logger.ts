import pino from "pino";
import { env } from "./env";

/** Structured JSON logs (one line per event); class run events carry `runId`, requests a request id, each line the process id. */
export const logger = pino({ level: env.NODE_ENV === "test" && !process.env.LOG_LEVEL ? "silent" : env.LOG_LEVEL });
