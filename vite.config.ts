import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";

const alias = {
  "@shared": fileURLToPath(new URL("./shared", import.meta.url)),
  "@": fileURLToPath(new URL("./src", import.meta.url)),
};
const apiPort = process.env.PORT ?? "3000";

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: { alias },
  server: {
    port: 5173,
    proxy: {
      "/api": `http://127.0.0.1:${apiPort}`,
      "/socket.io": { target: `http://127.0.0.1:${apiPort}`, ws: true },
    },
  },
  build: { outDir: "dist/client", sourcemap: true },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: "unit", include: ["tests/shared/**/*.test.ts", "tests/client/**/*.test.ts"], environment: "node" },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          include: ["tests/server/**/*.test.ts"],
          globalSetup: ["tests/helpers/database-setup.ts"],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: "browser",
          include: ["tests/e2e/**/*.test.ts"],
          globalSetup: ["tests/helpers/app-server-setup.ts"],
          testTimeout: 90_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
