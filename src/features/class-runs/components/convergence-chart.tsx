import { Area, CartesianGrid, ComposedChart, Line, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { PooledMatchup } from "@shared/class-results/pooled-results";

const colours = { frequency: "#12263a", exact: "#b45309", band: "#9fd8cf" };

/** What the chart plots under each tie rule, in words. */
export function frequencyMeaning(entry: PooledMatchup, tieRule: string): string {
  const first = entry.seats[0].dieName;
  if (tieRule === "re-roll-ties") return `${first}'s share of the rolls that were not ties`;
  if (tieRule === "ties-score-half") return `${first}'s points per roll (a tie scores half)`;
  return `${first}'s share of wins`;
}

/**
 * Running relative frequency against the number of rolls, with the exact value as a dashed line and the 95% band
 * around it (normal approximation, common practice) in which a fair class's frequency usually stays.
 */
export function ConvergenceChart({
  entry,
  tieRule,
  large = false,
  showExact = true,
}: {
  entry: PooledMatchup;
  tieRule: string;
  large?: boolean;
  showExact?: boolean;
}) {
  const exact = showExact ? (entry.exact.underTieRule?.value ?? null) : null;
  // The band is centred on the exact value, so it is left out with it.
  const data = entry.convergence.map((point) => ({
    rolls: point.rolls,
    frequency: point.frequency,
    band: !showExact || point.bandLower === null || point.bandUpper === null ? null : [point.bandLower, point.bandUpper],
  }));
  const last = entry.convergence.at(-1);
  const font = large ? 22 : 13;
  return (
    <figure className="flex flex-col gap-2">
      <div
        className={large ? "h-[42vh]" : "h-64"}
        role="img"
        aria-label={`Convergence chart: ${frequencyMeaning(entry, tieRule)} after each roll${showExact ? `, with the exact value ${entry.exact.underTieRule?.fraction ?? "none"}` : ""}.`}
      >
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={data} margin={{ top: 8, right: 16, bottom: large ? 28 : 20, left: 0 }}>
            <CartesianGrid stroke={large ? "#3b4f63" : "#d8cfc0"} strokeDasharray="2 4" />
            <XAxis
              dataKey="rolls"
              type="number"
              domain={[1, Math.max(2, last?.rolls ?? 2)]}
              tick={{ fontSize: font, fill: large ? "#ffffff" : "#3b4f63" }}
              label={{ value: "Rolls", position: "insideBottom", offset: -12, fontSize: font, fill: large ? "#ffffff" : "#12263a" }}
            />
            <YAxis
              domain={[0, 1]}
              ticks={[0, 0.25, 0.5, 0.75, 1]}
              tick={{ fontSize: font, fill: large ? "#ffffff" : "#3b4f63" }}
              width={large ? 70 : 44}
            />
            {!large && (
              <Tooltip
                formatter={(value) =>
                  Array.isArray(value) ? value.map((part) => Number(part).toFixed(3)).join(" to ") : Number(value).toFixed(3)
                }
              />
            )}
            {showExact && (
              <Area
                dataKey="band"
                name="95% band around the exact value"
                stroke="none"
                fill={colours.band}
                fillOpacity={large ? 0.35 : 0.55}
                isAnimationActive={false}
                connectNulls
              />
            )}
            {exact !== null && <ReferenceLine y={exact} stroke={colours.exact} strokeWidth={large ? 4 : 2} strokeDasharray="8 5" />}
            <Line
              dataKey="frequency"
              name="Class's relative frequency"
              stroke={large ? "#ffffff" : colours.frequency}
              strokeWidth={large ? 4 : 2.5}
              dot={false}
              isAnimationActive={false}
              connectNulls
            />
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <ul className={`flex flex-wrap gap-x-5 gap-y-1 ${large ? "text-2xl" : "text-sm"}`} aria-label="Key">
        <li className="flex items-center gap-2">
          <svg width="34" height="10" aria-hidden="true">
            <line x1="0" y1="5" x2="34" y2="5" stroke={large ? "#ffffff" : colours.frequency} strokeWidth="4" />
          </svg>
          Class’s relative frequency (solid)
        </li>
        {showExact && (
          <>
            <li className="flex items-center gap-2">
              <svg width="34" height="10" aria-hidden="true">
                <line x1="0" y1="5" x2="34" y2="5" stroke={colours.exact} strokeWidth="4" strokeDasharray="8 5" />
              </svg>
              Exact value (dashed)
            </li>
            <li className="flex items-center gap-2">
              <svg width="34" height="14" aria-hidden="true">
                <rect width="34" height="14" fill={colours.band} opacity={large ? 0.6 : 0.8} />
              </svg>
              95% band (shaded)
            </li>
          </>
        )}
      </ul>
      <figcaption className={large ? "text-2xl" : "text-sm text-ink-soft"}>
        {frequencyMeaning(entry, tieRule)} after each of {entry.rolls} rolls
        {showExact && entry.exact.underTieRule
          ? `; exact value ${entry.exact.underTieRule.fraction} ≈ ${entry.exact.underTieRule.decimal}`
          : ""}
        .
      </figcaption>
    </figure>
  );
}
