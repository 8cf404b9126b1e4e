import { Area, CartesianGrid, ComposedChart, Line, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import type { PooledMatchup } from "@shared/class-results/pooled-results";
import { three, tieRulePhrase } from "./figures";

type ChartPoint = { rolls: number; frequency: number | null; band: [number, number] | null };

/**
 * The running relative frequency of the matchup's first die after each roll, beside its exact value (dashed) and the
 * 95% band around it; the figure caption says in words what the chart shows.
 */
export function ConvergenceChart({
  matchup,
  tieRule,
  size,
}: {
  matchup: PooledMatchup;
  tieRule: string;
  /** A fixed size for print; without it the chart fills its column. */
  size?: { width: number; height: number };
}) {
  const exact = matchup.exact.underTieRule;
  const data: ChartPoint[] = matchup.convergence.map((point) => ({
    rolls: point.rolls,
    frequency: point.frequency,
    band: point.bandLower === null || point.bandUpper === null ? null : [point.bandLower, point.bandUpper],
  }));
  const last = matchup.convergence[matchup.convergence.length - 1];
  const firstDie = matchup.seats[0].dieName;
  const chartProps = size ? { width: size.width, height: size.height } : { responsive: true, style: { width: "100%", height: 300 } };
  return (
    <figure className="min-w-0">
      <div
        role="img"
        aria-label={`Convergence chart of ${matchup.label}: the class estimate of ${firstDie} winning after ${matchup.countedRolls > 0 ? `${matchup.rolls - matchup.countedRolls} rolls recorded one by one` : `${matchup.rolls} rolls`} is ${three(last?.frequency)}; the exact value is ${exact?.fraction ?? "undefined"}.`}
      >
        <ComposedChart data={data} margin={{ top: 12, right: 16, bottom: 24, left: 4 }} {...chartProps}>
          <CartesianGrid stroke="#d8cfc0" strokeDasharray="2 4" />
          <XAxis
            dataKey="rolls"
            type="number"
            domain={[1, "dataMax"]}
            allowDecimals={false}
            tick={{ fill: "#3b4f63" }}
            label={{ value: "rolls", position: "insideBottom", offset: -12, fill: "#3b4f63" }}
          />
          <YAxis domain={[0, 1]} ticks={[0, 0.25, 0.5, 0.75, 1]} tick={{ fill: "#3b4f63" }} width={44} />
          <Area
            dataKey="band"
            stroke="none"
            fill="#d5f0ec"
            fillOpacity={0.9}
            isAnimationActive={false}
            name="95% band around the exact value"
            connectNulls
          />
          {exact && <ReferenceLine y={exact.value} stroke="#12263a" strokeDasharray="6 4" strokeWidth={2} />}
          <Line
            dataKey="frequency"
            stroke="#0f6b63"
            strokeWidth={2.5}
            dot={false}
            isAnimationActive={false}
            name={`${firstDie} wins (relative frequency)`}
            connectNulls
          />
          {!size && (
            <Tooltip
              formatter={(value) => (Array.isArray(value) ? value.map((entry) => three(Number(entry))).join(" to ") : three(Number(value)))}
              labelFormatter={(label) => `after ${label} rolls`}
            />
          )}
        </ComposedChart>
      </div>
      <figcaption className="mt-2 text-sm text-ink-soft">
        <span className="mr-3 inline-flex items-center gap-1">
          <svg aria-hidden="true" width="28" height="8">
            <line x1="0" y1="4" x2="28" y2="4" stroke="#0f6b63" strokeWidth="3" />
          </svg>
          class estimate ({firstDie} wins, {tieRulePhrase(tieRule)})
        </span>
        <span className="mr-3 inline-flex items-center gap-1">
          <svg aria-hidden="true" width="28" height="8">
            <line x1="0" y1="4" x2="28" y2="4" stroke="#12263a" strokeWidth="2" strokeDasharray="6 4" />
          </svg>
          exact {exact ? `${exact.fraction} (${exact.decimal})` : "—"}
        </span>
        <span className="inline-flex items-center gap-1">
          <svg aria-hidden="true" width="20" height="12">
            <rect width="20" height="12" fill="#d5f0ec" stroke="#0f6b63" strokeWidth="1" />
          </svg>
          where 95% of class estimates fall for fair dice
        </span>
        {matchup.countedRolls > 0 && (
          <span className="mt-1 block" data-testid="counted-rolls-note">
            {matchup.countedRolls} of the {matchup.rolls} rolls were entered as win/tie/loss counts: they are in the table and the interval,
            but have no order, so the chart shows only the {matchup.rolls - matchup.countedRolls} recorded one by one.
          </span>
        )}
      </figcaption>
    </figure>
  );
}
