import { z } from "zod";
import type { PooledResults } from "../class-results/pooled-results";
import type { SetDie } from "./dice-sets";
import { normaliseNickname, nicknameProblem } from "../class-runs/nickname-rules";
import { joinCodeSchema } from "./joining";
import { LESSON_PHASES, type LessonPhaseName } from "./lessons";

/** A class run's status: open takes rolls, paused keeps phones waiting, closed takes nothing more. */
export const runStatusSchema = z.enum(["open", "paused", "closed"], { error: "A run is open, paused or closed." });
export type RunStatus = z.infer<typeof runStatusSchema>;
export const runStatusLabels: Record<RunStatus, string> = { open: "Open", paused: "Paused", closed: "Closed" };

export const runPhaseSchema = z.enum(LESSON_PHASES, { error: `The phase is one of ${LESSON_PHASES.join(", ")}.` });
export type RunPhase = LessonPhaseName;

/** What a phase asks of pupils, shown on the Roll pad and the Wall view. */
export const runPhaseHints: Record<RunPhase, string> = {
  Guess: "Vote for the die you think is best.",
  Roll: "Play your matchup and record every roll.",
  Pool: "The class's rolls are put together.",
  Prove: "The tree diagram gives the exact chances.",
  Twist: "A new way to play: record again from zero.",
  Reflect: "Talk it through: was there a best die?",
};

export { JOIN_CODE_ALPHABET, JOIN_CODE_LENGTH, joinCodeSchema, NICKNAME_MAX, NICKNAME_MIN } from "./joining";

export { nicknameProblem } from "../class-runs/nickname-rules";

/** A group nickname, NFKC-normalised: the rules of `nicknameProblem` (shared/class-runs/nickname-rules.ts). */
export const nicknameSchema = z
  .string({ error: "Choose a group nickname." })
  .check((context) => {
    // Checked before normalising, since NFKC would hide some characters the rules refuse.
    const problem = nicknameProblem(context.value);
    if (problem) context.issues.push({ code: "custom", message: problem, input: context.value });
  })
  .transform(normaliseNickname);

export const classRunIdParamsSchema = z.object({ id: z.uuid({ error: "That is not a class run id." }) });
export const runGroupParamsSchema = classRunIdParamsSchema.extend({ groupId: z.uuid({ error: "That is not a group id." }) });
export const padCodeParamsSchema = z.object({ code: joinCodeSchema });

/** Groups a run takes unless the teacher says otherwise when opening it (a class of 30 working alone, with a few spare). */
export const GROUP_CAP_DEFAULT = 40;
/** The most groups any run takes. */
export const GROUP_CAP_MAX = 60;

/** A run's group cap, set when the teacher opens it. */
export const groupCapSchema = z
  .number({ error: "Say how many groups may join." })
  .int({ error: "The group cap is a whole number." })
  .min(1, { error: "Let at least 1 group join." })
  .max(GROUP_CAP_MAX, { error: `A run takes at most ${GROUP_CAP_MAX} groups.` });

/** Body of POST /api/class-runs: open a run of one of the teacher's lessons, with an optional group cap. */
export const openClassRunSchema = z.object({
  lessonId: z.uuid({ error: "Pick one of your lessons." }),
  groupCap: groupCapSchema.optional(),
});
export type OpenClassRunInput = z.infer<typeof openClassRunSchema>;

/** Body of POST /api/class-runs/:id/status. */
export const runStatusChangeSchema = z.object({ status: runStatusSchema });

/** How the Twist phase changes the game. */
export const twistModeSchema = z.enum(["two-dice-each", "three-players"], { error: "The twist is two dice each or three players." });
export type TwistMode = z.infer<typeof twistModeSchema>;
export const twistModeLabels: Record<TwistMode, string> = { "two-dice-each": "Two dice each", "three-players": "Three players" };

/** Body of POST /api/class-runs/:id/phase; entering Twist names the twist (a fresh tally starts). */
export const runPhaseChangeSchema = z.object({ phase: runPhaseSchema, twist: twistModeSchema.optional() });
export type RunPhaseChange = z.infer<typeof runPhaseChangeSchema>;

/** A matchup: die indexes into the run's dice, one per player, all different. */
export const matchupSchema = z
  .array(
    z.number().int({ error: "Name each die by its number in the set." }).min(0, { error: "Name each die by its number in the set." }),
    {
      error: "A matchup lists one die per player.",
    },
  )
  .min(2, { error: "A matchup needs two or three dice." })
  .max(3, { error: "A matchup needs two or three dice." })
  .refine((matchup) => new Set(matchup).size === matchup.length, { error: "Each player in a matchup uses a different die." });

/** Body of PUT /api/class-runs/:id/groups/:groupId/matchup (the teacher assigns a group's matchup). */
export const groupMatchupSchema = z.object({ matchup: matchupSchema });

/** Body of PATCH /api/class-runs/:id/groups/:groupId: the teacher renames a group (the same nickname rules as a join). */
export const groupRenameSchema = z.object({ nickname: nicknameSchema });

/** Body of PUT /api/class-runs/:id/groups/:groupId/left-out: leave the group's rolls out of every figure, or count them again. */
export const groupLeftOutSchema = z.object({ leftOut: z.boolean({ error: "Say whether the group's rolls are left out." }) });

/** Body of PUT /api/class-runs/:id/joining: lock joining (no new groups) or unlock it. */
export const runJoiningSchema = z.object({ locked: z.boolean({ error: "Say whether joining is locked." }) });

export const SIMULATED_ROLLS_MAX = 20_000;
/** Body of POST /api/class-runs/:id/simulated-groups: the virtual class. */
export const simulatedGroupsSchema = z
  .object({
    groups: z
      .number({ error: "Say how many simulated groups." })
      .int()
      .min(1, { error: "Add at least 1 group." })
      .max(20, { error: "Add at most 20 groups at once." }),
    rollsPerGroup: z
      .number({ error: "Say how many rolls each group makes." })
      .int({ error: "Rolls must be a whole number." })
      .min(1, { error: "Each group makes at least 1 roll." })
      .max(5000, { error: "Each group makes at most 5000 rolls." }),
    seed: z
      .number()
      .int()
      .min(0)
      .max(2 ** 32 - 1)
      .optional(),
  })
  .refine((input) => input.groups * input.rollsPerGroup <= SIMULATED_ROLLS_MAX, {
    error: `Simulate at most ${SIMULATED_ROLLS_MAX} rolls at once.`,
    path: ["rollsPerGroup"],
  });
export type SimulatedGroupsInput = z.infer<typeof simulatedGroupsSchema>;

/** One tally of a run and the mode its rolls were recorded in. */
export type RunTally = { tally: number; dicePerPlayer: number; players: number; startedAt: string };

/** A class run as the teacher's screens see it. */
export type ClassRun = {
  id: string;
  title: string;
  classGroup: string;
  lessonId: string | null;
  diceSetName: string;
  dice: SetDie[];
  /** The mode rolls are recorded in now (the Twist's once it starts); the run's main mode is `tallies[0]`. */
  dicePerPlayer: number;
  players: number;
  tieRule: "re-roll-ties" | "ties-score-half" | "ties-score-nothing";
  matchupChoice: "assigned" | "group-choice";
  phases: RunPhase[];
  phase: RunPhase;
  status: RunStatus;
  joinCode: string;
  /** The Roll pad's path for this run, e.g. "/pad/KX7RTM"; the screens add the address phones use. */
  joinPath: string;
  /** APP_ORIGIN when the server was given one (the address phones can reach); otherwise null and the browser's own is used. */
  configuredOrigin: string | null;
  currentTally: number;
  /** Every tally so far; the first is the run's main mode (the lesson's own), a second is the Twist. */
  tallies: RunTally[];
  /** Copied from the lesson when the run opened: the Wall view shows no exact value before the Prove phase. */
  hideExactUntilProve: boolean;
  /** The lesson's discussion prompts and exit ticket, copied when the run opened, for the Wall view's Reflect phase. */
  discussionPrompts: string[];
  exitTicket: string;
  boardVersion: number;
  /** The teacher locked joining: no new group may join (groups already in carry on). */
  joiningLocked: boolean;
  /** Most groups this run takes (set when it was opened). */
  groupCap: number;
  /** Most phone rolls this run takes (ROLL_CEILING_PER_RUN); beyond it rolls are refused `run_roll_ceiling`. */
  rollCeiling: number;
  /** When the run reached its roll ceiling (the board's flood flag), or null. */
  rollCeilingReachedAt: string | null;
  ownerId: string;
  /** Whether the teacher asking opened this run (board updates pushed to every watcher say false; compare ownerId instead). */
  isOwner: boolean;
  ownerName: string;
  createdAt: string;
  closedAt: string | null;
};

/** One row of the Class runs list. */
export type ClassRunSummary = Pick<
  ClassRun,
  "id" | "title" | "classGroup" | "diceSetName" | "phase" | "status" | "joinCode" | "createdAt" | "closedAt"
> & {
  groupCount: number;
  rollCount: number;
};

/** A lesson the teacher may open a run of. */
export type RunnableLesson = {
  id: string;
  title: string;
  classGroup: string;
  diceSetName: string | null;
  /** Why the lesson cannot be run yet (no dice set, or a plan that does not check), or null. */
  problem: string | null;
  openRunId: string | null;
};

/** A group as the Run board lists it. */
export type BoardGroup = {
  id: string;
  nickname: string;
  source: "phone" | "simulated" | "paper";
  matchup: number[] | null;
  rolls: number;
  vote: number | null;
  createdAt: string;
  /** The teacher left this group's rolls out: they are kept but in no figure or export unless asked for. */
  leftOut: boolean;
  /** When the group's phone last sent rolls faster than a group can play (refused `rate_limited`), or null: the board's flood flag. */
  floodedAt: string | null;
};

/** The Run board's whole state, read from the database at `version` (class_run.board_version). */
export type BoardSnapshot = {
  runId: string;
  version: number;
  run: ClassRun;
  groups: BoardGroup[];
  /** Guess votes per die index. */
  votes: number[];
  /** Per tally: every roll pooled, and the class's own rolls without the virtual class's (null when there are no simulated rolls). */
  tallies: { tally: RunTally; pooled: PooledResults; withoutSimulated: PooledResults | null }[];
  /** Undone rolls are kept (so a resend cannot revive them) and counted here. */
  undoneRolls: number;
  generatedAt: string;
};

/** What the Roll pad's code box looks up (GET /api/pad/:code): enough to show the run before a group joins. */
export type PadRunPreview = { runId: string; title: string; classGroup: string; status: RunStatus; phase: RunPhase; joinCode: string };
