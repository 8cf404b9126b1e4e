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
    default:
      return null;
  }
}

/** The hex colour of a palette colour name (ink when unknown). */
export function paletteHex(colour: string): string {
  return diePalette.find((entry) => entry.colour === colour)?.hex ?? "#12263a";
}

/**
 * An SVG <pattern> for a die's colour and pattern, to be placed inside an <svg>'s <defs> and used as fill="url(#id)".
 * `scale` sets the tile size in the user units of the surrounding SVG.
 */
export function DiePatternDef({ id, colour, pattern, scale = 10 }: { id: string; colour: string; pattern: string; scale?: number }) {
  const hex = paletteHex(colour);
  return (
    <pattern id={id} patternUnits="userSpaceOnUse" width={scale} height={scale} viewBox={`0 0 ${tile} ${tile}`}>
      <rect width={tile} height={tile} fill="#ffffff" />
      <PatternMotif pattern={pattern} hex={hex} />
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
