/** One chunk as Vite's build manifest (`.vite/manifest.json`) lists it. */
export type ManifestChunk = {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
  css?: string[];
  assets?: string[];
};

/** The Roll pad's page, as Vite's manifest names it. */
export const PAD_ENTRY = "pad.html";

/**
 * Every file the Roll pad's page loads, read from Vite's build manifest: its entry chunk, the chunks it imports
 * (statically or not), their CSS and assets. The service worker precaches exactly these, and a test checks what is in them.
 */
export function padEntryFiles(manifest: Record<string, ManifestChunk>, entry = PAD_ENTRY): { chunks: string[]; files: string[] } {
  const seen = new Set<string>();
  const files = new Set<string>();
  const visit = (key: string) => {
    if (seen.has(key)) return;
    const chunk = manifest[key];
    if (!chunk) throw new Error(`The build manifest has no chunk ${key}.`);
    seen.add(key);
    files.add(chunk.file);
    for (const file of [...(chunk.css ?? []), ...(chunk.assets ?? [])]) files.add(file);
    for (const next of [...(chunk.imports ?? []), ...(chunk.dynamicImports ?? [])]) visit(next);
  };
  visit(entry);
  return { chunks: [...seen].map((key) => manifest[key].file), files: [...files] };
}
