import { readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { defineConfig, type Plugin } from "vitest/config";
import react from "@vitejs/plugin-react";
import tailwindcss from "@tailwindcss/vite";
import { compression } from "vite-plugin-compression2";
import { VitePWA } from "vite-plugin-pwa";
import { padEntryFiles, type ManifestChunk } from "./scripts/build/pad-entry-files";

const alias = {
  "@shared": fileURLToPath(new URL("./shared", import.meta.url)),
  "@": fileURLToPath(new URL("./src", import.meta.url)),
};
const apiPort = process.env.PORT ?? "3000";
const root = fileURLToPath(new URL(".", import.meta.url));

/** The build's output folder (tests build into a folder of their own with --outDir). */
let outDir = "dist/client";

/** Writes `.vite/chunk-modules.json` (each chunk's source modules), so a test can see which packages the pad's chunks hold. */
function chunkModules(): Plugin {
  return {
    name: "outroll-chunk-modules",
    apply: "build",
    configResolved(config) {
      outDir = path.resolve(config.root, config.build.outDir);
    },
    generateBundle(_options, bundle) {
      const modules: Record<string, string[]> = {};
      for (const output of Object.values(bundle)) {
        if (output.type === "chunk") modules[output.fileName] = output.moduleIds.map((id) => path.relative(root, id.replace(/^\0/, "")));
      }
      this.emitFile({ type: "asset", fileName: ".vite/chunk-modules.json", source: JSON.stringify(modules, null, 1) });
    },
  };
}

/** In `vite` dev, /pad and /pad/CODE open the Roll pad's page, as the server does in production. */
function padPageInDev(): Plugin {
  return {
    name: "outroll-pad-page-in-dev",
    apply: "serve",
    configureServer(server) {
      server.middlewares.use((req, _res, next) => {
        if (req.url && /^\/pad(\/[^.]*)?(\?.*)?$/.test(req.url)) req.url = "/pad.html";
        next();
      });
    },
  };
}

export default defineConfig(({ mode }) => ({
  plugins: [
    react(),
    tailwindcss(),
    padPageInDev(),
    chunkModules(),
    VitePWA({
      // The worker serves the Roll pad only: it is registered by the pad with scope /pad, and precaches the pad's files alone.
      injectRegister: false,
      manifest: false,
      filename: "pad-sw.js",
      workbox: {
        globPatterns: ["pad.html", "pad.webmanifest", "pad-icon*", "assets/**/*.{js,css,woff2}"],
        navigateFallback: "pad.html",
        navigateFallbackAllowlist: [/^\/pad(\/|$)/],
        cleanupOutdatedCaches: true,
        clientsClaim: true,
        skipWaiting: true,
        manifestTransforms: [
          (entries) => {
            const manifest = JSON.parse(readFileSync(path.join(outDir, ".vite/manifest.json"), "utf8")) as Record<string, ManifestChunk>;
            const padFiles = new Set([
              ...padEntryFiles(manifest).files,
              "pad.html",
              "pad.webmanifest",
              "pad-icon.svg",
              "pad-icon-192.png",
              "pad-icon-512.png",
            ]);
            return { manifest: entries.filter((entry) => padFiles.has(entry.url)), warnings: [] };
          },
        ],
      },
    }),
    compression({ algorithms: ["gzip", "brotliCompress"], exclude: [/\.map$/, /\.(png|woff2)$/] }),
  ],
  resolve: { alias },
  server: {
    port: 5173,
    proxy: {
      "/api": `http://127.0.0.1:${apiPort}`,
      "/socket.io": { target: `http://127.0.0.1:${apiPort}`, ws: true },
    },
  },
  build: {
    outDir: "dist/client",
    manifest: true,
    // Maps stay on disk beside the build for reading stack traces; the server never serves them.
    sourcemap: mode === "production" ? "hidden" : true,
    rolldownOptions: {
      input: { app: fileURLToPath(new URL("./index.html", import.meta.url)), pad: fileURLToPath(new URL("./pad.html", import.meta.url)) },
    },
  },
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
}));
