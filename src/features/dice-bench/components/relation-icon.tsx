import type { MatchupRelation } from "@shared/probability/index";

/** A shape for each relation (filled up-triangle, hollow down-triangle, equals sign), so no cell relies on colour. */
export function RelationIcon({ relation, className = "h-4 w-4" }: { relation: MatchupRelation; className?: string }) {
  return (
    <svg viewBox="0 0 16 16" className={`inline-block shrink-0 ${className}`} aria-hidden="true">
      {relation === "beats" && <path d="M8 2 L14.5 13.5 H1.5 Z" fill="currentColor" />}
      {relation === "loses" && <path d="M8 14 L14.5 2.5 H1.5 Z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />}
      {relation === "even" && <path d="M2.5 5.5 H13.5 M2.5 10.5 H13.5" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />}
    </svg>
  );
}

export const relationWords: Record<MatchupRelation, string> = { beats: "beats", loses: "loses to", even: "even with" };
