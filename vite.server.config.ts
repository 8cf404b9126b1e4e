import { fileURLToPath } from "node:url";
import { builtinModules } from "node:module";
import { defineConfig } from "vite";

/**
 * The server's production build (npm run build): plain JavaScript in dist/server/, so production runs `node` without
 * tsx. Each worker thread's script and the migrate and seed commands are entries of their own beside index.js;
 * npm packages stay external and load from node_modules.
 */
export default defineConfig({
  resolve: { alias: { "@shared": fileURLToPath(new URL("./shared", import.meta.url)) } },
  build: {
    ssr: true,
    outDir: "dist/server",
    emptyOutDir: true,
    target: "node20",
    sourcemap: true,
    minify: false,
    rollupOptions: {
      input: {
        index: "server/index.ts",
        "search-worker": "server/set-finder/search-worker.ts",
        "pooling-worker": "server/pooling/pooling-worker.ts",
        migrate: "server/db/migrate-cli.ts",
        seed: "seed/index.ts",
      },
      external: [...builtinModules, ...builtinModules.map((name) => `node:${name}`)],
      output: { format: "esm", entryFileNames: "[name].js", chunkFileNames: "chunks/[name]-[hash].js" },
    },
  },
  publicDir: false,
});
