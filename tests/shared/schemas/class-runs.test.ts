import { describe, expect, it } from "vitest";
import { joinCodeSchema, nicknameProblem, nicknameSchema } from "@shared/schemas/class-runs";

describe("group nicknames", () => {
  it.each(["Rockpool Rangers", "Gull Patrol", "Essex Lions", "Dickens Fans", "Cocktail Crew", "Group 717", "Team 12!", "Kelp & Co."])(
    "accepts %j",
    (nickname) => {
      expect(nicknameProblem(nickname)).toBeNull();
    },
  );

  it.each([
    ["A", "at least 2 characters"],
    ["The Very Long Nickname Indeed", "24 characters or fewer"],
    ["amy.b@school.test", "e-mail address"],
    ["07700 900 123", "phone number"],
    ["www.example.com", "Web addresses"],
    ["<script>", "simple punctuation"],
    ["Sh1t Kickers", "friendlier"],
    ["F U C K", "friendlier"],
    ["Dick Heads", "friendlier"],
  ])("refuses %j with a reason mentioning %j", (nickname, reason) => {
    expect(nicknameProblem(nickname)).toContain(reason);
  });

  it("tidies spaces before checking", () => {
    expect(nicknameSchema.parse("  Tide   Turners ")).toBe("Tide Turners");
  });
});

describe("join codes", () => {
  it("forgives case, spaces and a dash", () => {
    expect(joinCodeSchema.parse("kx7 rtm")).toBe("KX7RTM");
    expect(joinCodeSchema.parse("KX7-RTM")).toBe("KX7RTM");
  });

  it.each(["KX7RT", "KX0RTM", "KX1RTM", "KXIRTM", "KXLRTM", "KXORTM"])("refuses %j", (code) => {
    expect(joinCodeSchema.safeParse(code).success).toBe(false);
  });
});
