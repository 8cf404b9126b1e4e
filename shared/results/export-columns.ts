/** Columns of the rolls export (CSV and the workbook's Rolls sheet), in order. */
export const rollsExportColumns = [
  "roll_time",
  "group",
  "tally",
  "matchup",
  "dice_per_player",
  "die_1",
  "faces_1",
  "total_1",
  "die_2",
  "faces_2",
  "total_2",
  "die_3",
  "faces_3",
  "total_3",
  "outcome",
  "winning_die",
  "source",
  "simulated",
  "roll_id",
] as const;
export type RollsExportColumn = (typeof rollsExportColumns)[number];
export type RollsExportRow = Record<RollsExportColumn, string | number | null>;

/** What each rolls-export column holds (shown in docs/file-formats.md and beside the download buttons). */
export const rollsExportColumnHelp: Record<RollsExportColumn, string> = {
  roll_time: "When the roll was recorded, ISO 8601 in UTC (Paper import rolls: the time of the import, in sheet order).",
  group: "The group's nickname.",
  tally: "1 for the main Roll phase; 2 and up for a fresh tally started in the Twist phase.",
  matchup: 'The dice of the matchup in seat order, joined by " v ".',
  dice_per_player: "How many dice each player rolled and summed (1 = one die each, 2 = two dice each).",
  die_1: "The first player's die.",
  faces_1: "The face(s) the first player rolled, joined by + with two dice each (the Paper import notation).",
  total_1: "The first player's total.",
  die_2: "The second player's die.",
  faces_2: "The face(s) the second player rolled.",
  total_2: "The second player's total.",
  die_3: "The third player's die (three players only, otherwise empty).",
  faces_3: "The face(s) the third player rolled (three players only).",
  total_3: "The third player's total (three players only).",
  outcome: '"<die> wins" for the single highest total, or "tie" when the highest total is shared.',
  winning_die: "The winning die, empty for a tie.",
  source: "phone, simulated (the virtual class) or paper (Paper import).",
  simulated: "yes for simulated rolls, no for rolls pupils made.",
  roll_id: "The roll's id, unique in Outroll.",
};

/** Columns of the summary export (CSV and the workbook's Summary sheet), in order. */
export const summaryExportColumns = [
  "section",
  "group",
  "matchup",
  "dice_per_player",
  "players",
  "rolls",
  "decided_rolls",
  "first_die",
  "first_die_wins",
  "first_die_ties",
  "first_die_losses",
  "tie_rule",
  "relative_frequency",
  "exact_fraction",
  "exact_decimal",
  "wilson_95_lower",
  "wilson_95_upper",
  "binomial_p_value",
  "implausible",
  "entered_as",
  "rolls_from_counts",
] as const;
export type SummaryExportColumn = (typeof summaryExportColumns)[number];
export type SummaryExportRow = Record<SummaryExportColumn, string | number | null>;

/** What each summary-export column holds. */
export const summaryExportColumnHelp: Record<SummaryExportColumn, string> = {
  section: "matchup for the whole class's figures of one matchup; group for one group's figures of one matchup.",
  group: "The group's nickname (group rows only).",
  matchup: 'The dice of the matchup, lowest-listed die first, joined by " v ".',
  dice_per_player: "Dice each player rolled and summed.",
  players: "2 or 3 players.",
  rolls: "Rolls counted (undone rolls are never counted).",
  decided_rolls: "Rolls with one single highest total (the rolls that count when ties are re-rolled).",
  first_die: "The die the frequencies and probabilities are about: the first die of the matchup.",
  first_die_wins: "Rolls the first die won outright.",
  first_die_ties: "Rolls in which the first die shared the highest total.",
  first_die_losses: "Rolls in which another die was higher.",
  tie_rule: "re-roll-ties, ties-score-half or ties-score-nothing: how ties count in the next four columns.",
  relative_frequency: "The first die's relative frequency of winning under the tie rule.",
  exact_fraction: "The exact probability of the same, as a fraction in lowest terms.",
  exact_decimal: "The exact probability to three decimal places.",
  wilson_95_lower: "Lower end of the Wilson 95% score interval around the relative frequency.",
  wilson_95_upper: "Upper end of the Wilson 95% score interval.",
  binomial_p_value: "Group rows: the exact two-sided binomial test's p-value of the group's outright wins against the exact chance.",
  implausible: "Group rows: yes when that p-value is below 0.01, a sign the recording may need checking.",
  entered_as:
    "rolls when every roll of the row was recorded one by one; counts when the row's rolls were typed into the tally grid as win/tie/loss counts only; rolls and counts when both.",
  rolls_from_counts:
    "How many of the row's rolls were entered as counts: they are in every figure of the row, but have no row in the rolls export and no point in the convergence chart.",
};
