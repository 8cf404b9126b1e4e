/**
 * Built-in list of published curriculum standards a learning objective may be tagged with. Every summary is our own short
 * wording, not the published text; the code (or key stage) is shown so a teacher can look the original up. Sources: the
 * Common Core State Standards for Mathematics (NGA Center and CCSSO, 2010), grade 7 "Statistics and Probability" cluster C
 * and high-school "Conditional Probability and the Rules of Probability" (S-CP); England's national curriculum in
 * mathematics (DfE, 2013), key stage 3 and key stage 4 probability statements. The list of statements was compiled from
 * memory of those documents (from memory).
 */
export interface CurriculumStandard {
  /** Stable key stored on an objective. */
  code: string;
  /** What the teacher sees beside the summary: the published code, or the key stage. */
  label: string;
  framework: CurriculumFramework;
  /** Our own short wording of what the standard asks for. */
  summary: string;
}

export type CurriculumFramework = "ccss-math" | "england-national-curriculum";

/** Display names of the frameworks, for grouping in pickers and on the printed plan. */
export const curriculumFrameworkNames: Record<CurriculumFramework, string> = {
  "ccss-math": "Common Core State Standards for Mathematics (US)",
  "england-national-curriculum": "National curriculum in England, mathematics",
};

const ccss = (code: string, summary: string): CurriculumStandard => ({ code, label: code, framework: "ccss-math", summary });
const england = (code: string, keyStage: "KS3" | "KS4", summary: string): CurriculumStandard => ({
  code,
  label: keyStage,
  framework: "england-national-curriculum",
  summary,
});

/** Every standard in the built-in list, grouped by framework and in published order. */
export const curriculumStandards: readonly CurriculumStandard[] = [
  ccss(
    "7.SP.C.5",
    "A probability is a number from 0 to 1 saying how likely an event is: near 0 unlikely, 1/2 as likely as not, near 1 likely.",
  ),
  ccss(
    "7.SP.C.6",
    "Estimate a probability from the long-run relative frequency of many trials, and predict roughly how often an event will happen from its probability.",
  ),
  ccss(
    "7.SP.C.7",
    "Build a probability model, use it to find probabilities, and compare them with observed frequencies, explaining any mismatch.",
  ),
  ccss("7.SP.C.7a", "Build a model in which every outcome is equally likely and use it to find the probabilities of events."),
  ccss(
    "7.SP.C.7b",
    "Build a model, not necessarily with equally likely outcomes, from the frequencies seen in data from a chance process.",
  ),
  ccss("7.SP.C.8", "Find probabilities of compound events with organised lists, tables, tree diagrams and simulation."),
  ccss("7.SP.C.8a", "The probability of a compound event is the fraction of the sample space in which it happens."),
  ccss(
    "7.SP.C.8b",
    "Show the sample space of a compound event as a list, a table or a tree diagram, and pick out the outcomes that make up the event.",
  ),
  ccss("7.SP.C.8c", "Design and run a simulation that produces frequencies for a compound event."),
  ccss("HSS-CP.A.1", "Describe events as subsets of a sample space, and as unions, intersections or complements of other events."),
  ccss(
    "HSS-CP.A.2",
    "Two events are independent exactly when the probability of both equals the product of their probabilities; use this to decide independence.",
  ),
  ccss("HSS-CP.A.3", "Read the conditional probability of A given B as P(A and B) / P(B), and independence as P(A | B) = P(A)."),
  ccss(
    "HSS-CP.A.4",
    "Build and read two-way frequency tables, using them as a sample space to judge independence and estimate conditional probabilities.",
  ),
  ccss("HSS-CP.A.5", "Explain conditional probability and independence in everyday words and situations."),
  ccss("HSS-CP.B.6", "Find P(A | B) as the share of B's outcomes that also lie in A, and say what it means in the model."),
  ccss("HSS-CP.B.7", "Use the addition rule P(A or B) = P(A) + P(B) − P(A and B) and say what it means in the model."),
  ccss("HSS-CP.B.8", "Use the general multiplication rule P(A and B) = P(A) · P(B | A) in a model with equally likely outcomes."),
  ccss("HSS-CP.B.9", "Count with permutations and combinations to find probabilities of compound events."),
  england(
    "EN-KS3-P1",
    "KS3",
    "Record and analyse how often outcomes occur in simple chance experiments, talking about fairness and equally or unequally likely outcomes on the 0 to 1 scale.",
  ),
  england("EN-KS3-P2", "KS3", "The probabilities of all the possible outcomes add up to 1."),
  england("EN-KS3-P3", "KS3", "List sets and their unions and intersections systematically with tables, grids and Venn diagrams."),
  england(
    "EN-KS3-P4",
    "KS3",
    "Write out the sample space for single and combined events with equally likely outcomes and use it to work out theoretical probabilities.",
  ),
  england("EN-KS4-P1", "KS4", "Use randomness, fairness and equally likely events to work out expected outcomes of repeated experiments."),
  england("EN-KS4-P2", "KS4", "Link expected relative frequencies to theoretical probability on the 0 to 1 scale."),
  england("EN-KS4-P3", "KS4", "Use the fact that the probabilities of an exhaustive set of outcomes add up to 1."),
  england("EN-KS4-P4", "KS4", "List sets and combinations of sets systematically, including with tree diagrams."),
  england("EN-KS4-P5", "KS4", "Unbiased samples settle towards the theoretical probabilities as the sample grows."),
  england(
    "EN-KS4-P6",
    "KS4",
    "Work out probabilities of independent and dependent combined events with tree diagrams and other pictures, knowing the assumptions behind them.",
  ),
  england(
    "EN-KS4-P7",
    "KS4",
    "Work out and explain conditional probabilities using expected frequencies in two-way tables, tree diagrams and Venn diagrams.",
  ),
];

/** The stored keys of every built-in standard, for validating a tagged objective. */
export const curriculumStandardCodes = curriculumStandards.map((standard) => standard.code) as [string, ...string[]];

/** Looks a standard up by its stored code; undefined for an unknown code. */
export function curriculumStandardByCode(code: string): CurriculumStandard | undefined {
  return curriculumStandards.find((standard) => standard.code === code);
}
