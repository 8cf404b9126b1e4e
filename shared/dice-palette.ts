// Kept apart from the dice set schemas, so the Roll pad draws dice without loading zod.
/** Our palette: every colour comes with its own pattern, so no die is told apart by colour alone. */
export const diePalette = [
  { colour: "teal", pattern: "dots", hex: "#0f766e" },
  { colour: "amber", pattern: "stripes", hex: "#b45309" },
  { colour: "plum", pattern: "checks", hex: "#7e22ce" },
  { colour: "slate", pattern: "waves", hex: "#475569" },
  { colour: "coral", pattern: "triangles", hex: "#c2410c" },
  { colour: "moss", pattern: "crosses", hex: "#4d7c0f" },
  { colour: "ocean", pattern: "rings", hex: "#1d4ed8" },
  { colour: "sand", pattern: "zigzags", hex: "#a16207" },
] as const;
