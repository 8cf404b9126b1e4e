// The one schema module drizzle-kit and the better-auth adapter read; each table lives in its own file.
export { user } from "./users";
export { session } from "./sessions";
export { account } from "./accounts";
export { verification } from "./verifications";
export { organization } from "./departments";
export { member } from "./department-members";
export { invitation } from "./invitations";
export { diceSet } from "./dice-sets";
export { lesson } from "./lessons";
export { lessonTemplate, lessonTemplateVersion, shelfProposal } from "./lesson-templates";
export { proposalDigest } from "./proposal-digests";
export { lessonAttachment } from "./lesson-attachments";
export { classRun, runGroup, guessVote, paperImport, roll } from "./class-runs";
export { paperCount } from "./paper-counts";
export { rateLimit } from "./rate-limits";
export { socketIoAttachment } from "./socket-io-attachments";
export { setFinderSearch } from "./set-finder-searches";
