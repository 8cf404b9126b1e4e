import { describe, expect, it } from "vitest";
import { validate as isUuid, version as uuidVersion } from "uuid";
import { joinAttemptId, joinRefusalText, waitText } from "@/features/class-runs/api/join-group";

describe("the Roll pad's words for a refused join", () => {
  it.each([
    [500, "a second"],
    [1_000, "a second"],
    [1_001, "2 seconds"],
    [20_000, "20 seconds"],
    [59_000, "59 seconds"],
    [60_000, "a minute"],
    [61_000, "2 minutes"],
    [undefined, "30 seconds"],
  ])("says a wait of %s ms as %s", (ms, text) => {
    expect(waitText(ms)).toBe(text);
  });

  it("names the wait for rate_limited and says plainly what locked joining and a full run mean", () => {
    expect(joinRefusalText("rate_limited", "slow down", 45_000)).toBe("Too many tries in a short time. Wait 45 seconds, then try again.");
    expect(joinRefusalText("joining_locked", "locked")).toContain("Your teacher has closed joining");
    expect(joinRefusalText("run_full", "full")).toContain("as many groups as your teacher allowed");
  });

  it("keeps the server's own message for refusals the pad has no words of its own for", () => {
    expect(joinRefusalText("nickname_taken", "Another group already uses “Gull Patrol”.")).toBe(
      "Another group already uses “Gull Patrol”.",
    );
  });
});

describe("join attempt ids", () => {
  const memory = () => {
    const values = new Map<string, string>();
    return { getItem: (key: string) => values.get(key) ?? null, setItem: (key: string, value: string) => void values.set(key, value) };
  };

  it("reuses the id of an unanswered attempt with the same code and nickname, and makes a new one for another nickname", () => {
    const storage = memory();
    const first = joinAttemptId("KTW3RN", "Harbour Otters", storage);
    expect(isUuid(first) && uuidVersion(first)).toBe(4);
    expect(joinAttemptId("KTW3RN", "Harbour Otters", storage)).toBe(first);
    const other = joinAttemptId("KTW3RN", "Quayside Puffins", storage);
    expect(other).not.toBe(first);
    expect(joinAttemptId("KTW3RN", "Harbour Otters", storage)).not.toBe(first);
  });
});
