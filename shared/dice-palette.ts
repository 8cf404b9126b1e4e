// Kept apart from the dice set schemas, so the Roll pad draws dice without loading zod.
/**
 * Our palette: every colour comes with its own pattern, so no die is told apart by colour alone. `hex` is the die's colour;
 * the pattern is drawn in `motif` on `ground`. The first eight are the original palette (still valid in every stored set and file);
 * the rest are the usual dice colours, so a die named "Red" can look red.
 */
export const diePalette = [
  { colour: "teal", pattern: "dots", hex: "#0f766e", motif: "#0f766e", ground: "#ffffff" },
  { colour: "amber", pattern: "stripes", hex: "#b45309", motif: "#b45309", ground: "#ffffff" },
  { colour: "plum", pattern: "checks", hex: "#7e22ce", motif: "#7e22ce", ground: "#ffffff" },
  { colour: "slate", pattern: "waves", hex: "#475569", motif: "#475569", ground: "#ffffff" },
  { colour: "coral", pattern: "triangles", hex: "#c2410c", motif: "#c2410c", ground: "#ffffff" },
  { colour: "moss", pattern: "crosses", hex: "#4d7c0f", motif: "#4d7c0f", ground: "#ffffff" },
  { colour: "ocean", pattern: "rings", hex: "#1d4ed8", motif: "#1d4ed8", ground: "#ffffff" },
  { colour: "sand", pattern: "zigzags", hex: "#a16207", motif: "#a16207", ground: "#ffffff" },
  { colour: "red", pattern: "diamonds", hex: "#c81e1e", motif: "#c81e1e", ground: "#ffffff" },
  { colour: "blue", pattern: "squares", hex: "#1e3a8a", motif: "#1e3a8a", ground: "#ffffff" },
  { colour: "green", pattern: "hexagons", hex: "#15803d", motif: "#15803d", ground: "#ffffff" },
  { colour: "yellow", pattern: "bricks", hex: "#eab308", motif: "#12263a", ground: "#fde047" },
  { colour: "white", pattern: "dashes", hex: "#94a3b8", motif: "#64748b", ground: "#ffffff" },
  { colour: "black", pattern: "grid", hex: "#111827", motif: "#ffffff", ground: "#111827" },
  { colour: "orange", pattern: "chevrons", hex: "#ea580c", motif: "#ea580c", ground: "#ffffff" },
  { colour: "purple", pattern: "hearts", hex: "#6b21a8", motif: "#6b21a8", ground: "#ffffff" },
  { colour: "pink", pattern: "bars", hex: "#db2777", motif: "#db2777", ground: "#ffffff" },
  { colour: "grey", pattern: "hatching", hex: "#4b5563", motif: "#4b5563", ground: "#ffffff" },
] as const;
