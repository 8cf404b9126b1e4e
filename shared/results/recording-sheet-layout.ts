/** What a group recording sheet follows: the lesson's rolls per group, players and dice each. */
export interface RecordingSheetPlan {
  rolls: number;
  players: number;
  dicePerPlayer: number;
}

/** One column of the sheet: a plain heading a 12-year-old reads, and the Paper import column(s) it becomes. */
export interface RecordingSheetColumn {
  heading: string;
  /** A short line under the heading. */
  help: string;
  /** The Paper import CSV column this column is typed into (the die columns come from the top of the sheet). */
  csvColumn: "roll" | "faces_1" | "faces_2" | "faces_3" | null;
}

/** Rows on one printed page (portrait, 7.5 mm each, under the heading). */
export const RECORDING_SHEET_ROWS_PER_PAGE = 25;
/** Most rows a sheet prints: more rolls than a Roll phase holds at any pace (see shared/lessons/roll-pace.ts). */
export const RECORDING_SHEET_ROWS_MAX = 200;
/** The sheet without a lesson: two players, one die each, 20 rolls. */
export const DEFAULT_RECORDING_SHEET_PLAN: RecordingSheetPlan = { rolls: 20, players: 2, dicePerPlayer: 1 };

/** The sheet's columns for a plan: the roll's number, what each player rolled, and who won. */
export function recordingSheetColumns(plan: Pick<RecordingSheetPlan, "players" | "dicePerPlayer">): RecordingSheetColumn[] {
  const rolled = (player: number): RecordingSheetColumn => ({
    heading: `Player ${player} rolled`,
    help: plan.dicePerPlayer === 1 ? "the number on top" : `both numbers, like 3 + 5`,
    csvColumn: `faces_${player}` as RecordingSheetColumn["csvColumn"],
  });
  return [
    { heading: "Roll", help: "", csvColumn: "roll" },
    ...Array.from({ length: plan.players }, (_, index) => rolled(index + 1)),
    {
      heading: "Who won?",
      help: plan.dicePerPlayer === 1 ? "the die with the biggest number, or “tie”" : "the biggest total, or “tie”",
      csvColumn: null,
    },
  ];
}

/** The roll numbers on each printed page: 1 … rolls, RECORDING_SHEET_ROWS_PER_PAGE to a page. */
export function recordingSheetPages(rolls: number): number[][] {
  const count = Math.max(1, Math.min(RECORDING_SHEET_ROWS_MAX, Math.floor(rolls)));
  const pages: number[][] = [];
  for (let start = 1; start <= count; start += RECORDING_SHEET_ROWS_PER_PAGE) {
    pages.push(Array.from({ length: Math.min(RECORDING_SHEET_ROWS_PER_PAGE, count - start + 1) }, (_, index) => start + index));
  }
  return pages;
}

/** A plan from the print page's address (?rolls=&players=&dice=), falling back to the default for anything missing or out of range. */
export function recordingSheetPlanFromParams(params: { get(name: string): string | null }): RecordingSheetPlan {
  const whole = (name: string, min: number, max: number, fallback: number) => {
    const value = Number(params.get(name));
    return params.get(name) !== null && Number.isInteger(value) && value >= min && value <= max ? value : fallback;
  };
  return {
    rolls: whole("rolls", 1, RECORDING_SHEET_ROWS_MAX, DEFAULT_RECORDING_SHEET_PLAN.rolls),
    players: whole("players", 2, 3, DEFAULT_RECORDING_SHEET_PLAN.players),
    dicePerPlayer: whole("dice", 1, 2, DEFAULT_RECORDING_SHEET_PLAN.dicePerPlayer),
  };
}
