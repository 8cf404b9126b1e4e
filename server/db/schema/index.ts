// The one schema module drizzle-kit and the better-auth adapter read; each table lives in its own file.
export { user } from "./users";
export { session } from "./sessions";
export { account } from "./accounts";
export { verification } from "./verifications";
export { organization } from "./departments";
export { member } from "./department-members";
export { invitation } from "./invitations";
