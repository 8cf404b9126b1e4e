import { useId } from "react";
import { diePalette } from "@shared/dice-palette";

const tile = 10;

/** The motif each palette pattern repeats, drawn in the die's colour on a 10 × 10 tile. */
function PatternMotif({ pattern, hex }: { pattern: string; hex: string }) {
  const stroke = { stroke: hex, strokeWidth: 1.6, fill: "none", strokeLinecap: "round" as const, strokeLinejoin: "round" as const };
  switch (pattern) {
    case "dots":
      return <circle cx="5" cy="5" r="2.2" fill={hex} />;
    case "stripes":
      return (
        <>
          <path d="M-1 11 L11 -1" {...stroke} strokeWidth={2.2} />
          <path d="M-1 1 L1 -1 M9 11 L11 9" {...stroke} strokeWidth={2.2} />
        </>
      );
    case "checks":
      return (
        <>
          <rect x="0" y="0" width="5" height="5" fill={hex} />
          <rect x="5" y="5" width="5" height="5" fill={hex} />
        </>
      );
    case "waves":
      return <path d="M0 5 Q2.5 1.5 5 5 T10 5" {...stroke} />;
    case "triangles":
      return <path d="M5 1.8 L8.6 8.2 L1.4 8.2 Z" fill={hex} />;
    case "crosses":
      return <path d="M5 2 V8 M2 5 H8" {...stroke} strokeWidth={1.8} />;
    case "rings":
      return <circle cx="5" cy="5" r="2.8" {...stroke} />;
    case "zigzags":
      return <path d="M0 7 L2.5 3 L5 7 L7.5 3 L10 7" {...stroke} />;
    case "diamonds":
      return <path d="M5 1.5 L8.5 5 L5 8.5 L1.5 5 Z" fill={hex} />;
    case "squares":
      return <rect x="2.4" y="2.4" width="5.2" height="5.2" {...stroke} />;
    case "hexagons":
      return <path d="M3.2 1.9 H6.8 L8.6 5 L6.8 8.1 H3.2 L1.4 5 Z" {...stroke} strokeWidth={1.4} />;
    case "bricks":
      return <path d="M0 0.5 H10 M0 5 H10 M0 9.5 H10 M5 0.5 V5 M0.5 5 V9.5" {...stroke} strokeWidth={1.2} strokeLinecap="butt" />;
    case "dashes":
      return <path d="M1 3 H5 M6 7.5 H9.5 M-0.5 7.5 H1" {...stroke} strokeWidth={1.8} />;
    case "grid":
      return <path d="M0 0.6 H10 M0.6 0 V10" {...stroke} strokeWidth={1.2} strokeLinecap="butt" />;
    case "chevrons":
      return <path d="M1 7 L5 3 L9 7" {...stroke} strokeWidth={1.8} />;
    case "hearts":
      return (
        <path d="M5 8.4 C1.2 5.8 1.2 2.4 3.3 2.2 C4.3 2.1 4.8 2.8 5 3.4 C5.2 2.8 5.7 2.1 6.7 2.2 C8.8 2.4 8.8 5.8 5 8.4 Z" fill={hex} />
      );
    case "bars":
      return <rect x="3.6" y="0" width="2.8" height="10" fill={hex} />;
    case "hatching":
      return <path d="M-1 11 L11 -1 M-1 -1 L11 11" {...stroke} strokeWidth={1} />;
    default:
      return null;
  }
}

/** The hex colour of a palette colour name (ink when unknown). */
export function paletteHex(colour: string): string {
  return diePalette.find((entry) => entry.colour === colour)?.hex ?? "#12263a";
}

/** The colours a palette colour's pattern is drawn with: the motif on its ground (ink on white when unknown). */
function patternColours(colour: string): { motif: string; ground: string } {
  const entry = diePalette.find((each) => each.colour === colour);
  return entry ? { motif: entry.motif, ground: entry.ground } : { motif: "#12263a", ground: "#ffffff" };
}

/**
 * An SVG <pattern> for a die's colour and pattern, to be placed inside an <svg>'s <defs> and used as fill="url(#id)".
 * `scale` sets the tile size in the user units of the surrounding SVG.
 */
export function DiePatternDef({ id, colour, pattern, scale = 10 }: { id: string; colour: string; pattern: string; scale?: number }) {
  const { motif, ground } = patternColours(colour);
  return (
    <pattern id={id} patternUnits="userSpaceOnUse" width={scale} height={scale} viewBox={`0 0 ${tile} ${tile}`}>
      <rect width={tile} height={tile} fill={ground} />
      <PatternMotif pattern={pattern} hex={motif} />
    </pattern>
  );
}

/** A small square showing a die's colour and pattern, so no die is told apart by colour alone. */
export function DieSwatch({
  colour,
  pattern,
  className = "h-6 w-6",
  label,
}: {
  colour: string;
  pattern: string;
  className?: string;
  /** Spoken label; without one the swatch is decorative (the die's name is beside it). */
  label?: string;
}) {
  const id = `swatch-${useId().replace(/:/g, "")}`;
  const hex = paletteHex(colour);
  return (
    <svg
      viewBox="0 0 24 24"
      className={`shrink-0 ${className}`}
      role={label ? "img" : undefined}
      aria-label={label}
      aria-hidden={label ? undefined : true}
    >
      <defs>
        <DiePatternDef id={id} colour={colour} pattern={pattern} scale={8} />
      </defs>
      <rect x="1" y="1" width="22" height="22" rx="4" fill={`url(#${id})`} stroke={hex} strokeWidth="2" />
    </svg>
  );
}
