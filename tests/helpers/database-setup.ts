// Vitest global set-up for integration tests: migrate and seed the throwaway test database once.
import { execFileSync } from "node:child_process";

export default function setup() {
  execFileSync("node", ["--import", "tsx", "seed/index.ts"], { stdio: "inherit", env: process.env });
}
