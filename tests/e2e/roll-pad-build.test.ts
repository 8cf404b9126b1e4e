import { readFileSync } from "node:fs";
import path from "node:path";
import { brotliDecompressSync } from "node:zlib";
import { describe, expect, inject, it } from "vitest";
import { padEntryFiles, type ManifestChunk } from "../../scripts/build/pad-entry-files";

const appUrl = inject("appUrl");
const clientDir = process.env.CLIENT_DIR ?? "dist/client";
const manifest = JSON.parse(readFileSync(path.join(clientDir, ".vite/manifest.json"), "utf8")) as Record<string, ManifestChunk>;
const chunkModules = JSON.parse(readFileSync(path.join(clientDir, ".vite/chunk-modules.json"), "utf8")) as Record<string, string[]>;

/** Packages (and parts of packages) the teachers' app uses and the Roll pad must not load. */
const appOnly = [
  /node_modules\/@tanstack\//,
  /node_modules\/react-router/,
  /node_modules\/better-auth\//,
  /node_modules\/@better-auth\//,
  /node_modules\/recharts\//,
  /node_modules\/react-hook-form\//,
  /node_modules\/@hookform\//,
  /node_modules\/qrcode\//,
  /node_modules\/fraction\.js\//,
  /node_modules\/papaparse\//,
  /node_modules\/exceljs\//,
  /node_modules\/zod\/v4\/classic\//,
];

/** The source modules inside the chunks an entry loads, from the build's chunk-modules.json. */
function modulesOf(entry: string): string[] {
  return padEntryFiles(manifest, entry).chunks.flatMap((file) => chunkModules[file] ?? []);
}

describe("the Roll pad's build", () => {
  it("loads none of the app-only packages (read from the build manifest), while the app's entry does load them", () => {
    const pad = modulesOf("pad.html");
    expect(pad.some((id) => id.includes("features/class-runs/components/roll-pad"))).toBe(true);
    expect(pad.filter((id) => appOnly.some((pattern) => pattern.test(id)))).toEqual([]);
    expect(pad.filter((id) => id.startsWith("src/app/"))).toEqual([]);
    // The check can see packages: the teachers' entry holds the router and the query library.
    const app = modulesOf("index.html");
    expect(app.some((id) => /node_modules\/react-router/.test(id))).toBe(true);
    expect(app.some((id) => /node_modules\/@tanstack\/query-core/.test(id))).toBe(true);
  });

  it("has the service worker precache the pad's files and none of the teachers' app", () => {
    const worker = readFileSync(path.join(clientDir, "pad-sw.js"), "utf8");
    for (const file of padEntryFiles(manifest).files.filter((name) => !name.endsWith(".woff"))) expect(worker).toContain(`"${file}"`);
    expect(worker).toContain('"pad.html"');
    expect(worker).not.toContain(manifest["index.html"].file);
    expect(worker).not.toContain('"index.html"');
  });

  it("serves the pad's page for /pad/CODE and the app's for other addresses, brotli-compressed and never cached unchecked", async () => {
    const pad = await fetch(`${appUrl}/pad/ABCDEF`, { headers: { "accept-encoding": "br, gzip" } });
    expect(pad.status).toBe(200);
    expect(pad.headers.get("content-encoding")).toBe("br");
    expect(pad.headers.get("cache-control")).toBe("no-cache");
    // fetch decodes the body; the page is the pad's, which loads the pad's entry chunk.
    expect(await pad.text()).toContain(manifest["pad.html"].file);
    const app = await fetch(`${appUrl}/app/lessons`);
    expect(await app.text()).toContain(manifest["index.html"].file);
    const worker = await fetch(`${appUrl}/pad-sw.js`);
    expect(worker.headers.get("cache-control")).toBe("no-cache");
  });

  it("serves hashed assets precompressed (brotli, else gzip) and cached for a year as immutable", async () => {
    const entry = manifest["pad.html"].file;
    const brotli = await fetch(`${appUrl}/${entry}`, { headers: { "accept-encoding": "br, gzip" } });
    expect(brotli.headers.get("content-encoding")).toBe("br");
    expect(brotli.headers.get("cache-control")).toBe("public, max-age=31536000, immutable");
    expect(brotli.headers.get("vary")?.toLowerCase()).toContain("accept-encoding");
    const onDisk = readFileSync(path.join(clientDir, entry));
    expect(brotliDecompressSync(readFileSync(path.join(clientDir, `${entry}.br`))).equals(onDisk)).toBe(true);
    const gzip = await fetch(`${appUrl}/${entry}`, { headers: { "accept-encoding": "gzip" } });
    expect(gzip.headers.get("content-encoding")).toBe("gzip");
    expect(Buffer.from(await gzip.arrayBuffer()).equals(onDisk)).toBe(true);
  });

  it("serves no source maps or build manifests, though the build keeps them on disk", async () => {
    expect((await fetch(`${appUrl}/.vite/manifest.json`)).status).toBe(404);
    expect((await fetch(`${appUrl}/.vite/chunk-modules.json`)).status).toBe(404);
    const map = `${manifest["pad.html"].file}.map`;
    expect(readFileSync(path.join(clientDir, map)).length).toBeGreaterThan(0);
    const response = await fetch(`${appUrl}/${map}`);
    expect(response.status).toBe(404);
    expect(await fetch(`${appUrl}/${manifest["pad.html"].file}`).then((entry) => entry.text())).not.toContain("sourceMappingURL");
  });
});
