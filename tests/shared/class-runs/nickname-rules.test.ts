import { describe, expect, it } from "vitest";
import { isReservedNickname, nicknameKey, nicknameProblem, normaliseNickname } from "@shared/class-runs/nickname-rules";
import { nicknameSchema } from "@shared/schemas/class-runs";

// Character names from the Unicode Standard's code charts (U+202E RIGHT-TO-LEFT OVERRIDE and so on).
const RLO = "\u202E";
const PDF = "\u202C";
const ZWSP = "\u200B";
const ZWJ = "\u200D";
const BOM = "\uFEFF";
const CYRILLIC_ES = "\u0441"; // looks like Latin c
const CYRILLIC_A = "\u0430"; // looks like Latin a
const CYRILLIC_O = "\u043E"; // looks like Latin o

describe("nicknames pupils may choose", () => {
  it.each([
    ["a place name with a rude word inside", "Penistone Pumas"],
    ["another such place name", "Scunthorpe Stars"],
    ["a Scottish town with a rude word inside", "Cumnock Crew"],
    ["a county that ends in 'sex'", "Essex Eagles"],
    ["a surname-like word that is no first name", "Dickens Fans"],
    ["a made-up team", "Kelp Crew"],
    ["a team with a number", "Group 717"],
    ["simple punctuation", "Kelp & Co."],
    ["a harbour creature", "Harbourside Gulls"],
    ["a first name alone", "Team Oliver"],
    ["a given name with a plural noun in lower case", "max power-ups"],
  ])("accepts %s: %j", (_case, nickname) => {
    expect(nicknameProblem(nickname)).toBeNull();
  });
});

describe("nicknames that are refused", () => {
  it.each([
    ["a right-to-left override hiding a word backwards", `${RLO}kcuf${PDF} Crew`, "invisible or direction-changing"],
    ["a zero-width space splitting a rude word", `Sh${ZWSP}it Kickers`, "invisible or direction-changing"],
    ["a zero-width joiner inside a name", `Kelp${ZWJ}Crew`, "invisible or direction-changing"],
    ["a byte order mark in front", `${BOM}Gull Patrol`, "invisible or direction-changing"],
    ["Cyrillic look-alike letters spelling a rude word", `Fu${CYRILLIC_ES}k Off`, "friendlier"],
    ["Cyrillic look-alikes of another rude word", `Tw${CYRILLIC_A}t Team`, "friendlier"],
    ["digits for letters", "Sh1t Kickers", "friendlier"],
    ["spaces between the letters", "F U C K", "friendlier"],
    ["dots between the letters", "P.E.N.I.S", "friendlier"],
    ["full-width letters", "ＦＵＣＫ ｃｒｅｗ", "friendlier"],
    ["a rude word as a word of its own", "Dick Heads", "friendlier"],
    ["a first name and a surname", "Emily Carter", "No real names"],
    ["another first name and surname", "Mohammed Khan", "No real names"],
    ["a first name and surname in lower case first", "oliver Smith", "No real names"],
    ["the virtual class's reserved name", "Virtual group 1", "virtual class"],
    ["a look-alike of the reserved name", `Virtual Gr${CYRILLIC_O}up 2`, "virtual class"],
    ["the reserved name with digits for letters", "Virtua1 group", "virtual class"],
    ["too short", "A", "at least 2 characters"],
    ["too long", "The Very Long Nickname Indeed", "24 characters or fewer"],
    ["an e-mail address", "amy.b@school.test", "e-mail address"],
    ["a phone number", "07700 900 123", "phone number"],
    ["a web address", "www.example.com", "Web addresses"],
    ["markup", "<script>", "simple punctuation"],
  ])("refuses %s: %j", (_case, nickname, reason) => {
    expect(nicknameProblem(nickname)).toContain(reason);
  });

  it("the schema refuses what the rules refuse and keeps the normalised form of what they accept", () => {
    expect(nicknameSchema.safeParse(`Kelp${ZWSP}Crew`).success).toBe(false);
    expect(nicknameSchema.parse("  Ｔｉｄｅ   Turners ")).toBe("Tide Turners");
  });
});

describe("look-alike keys", () => {
  it.each([
    ["Cyrillic letters", "Kelp Crew", `Kelp ${CYRILLIC_ES}rew`],
    ["capital I for small l", "Kelp Crew", "KeIp Crew"],
    ["case and spacing", "Kelp Crew", "kelp  crew"],
    ["a hyphen", "Kelp Crew", "Kelp-Crew"],
    ["full-width letters", "Gull Patrol", "Ｇｕｌｌ Patrol"],
  ])("gives one key to nicknames that differ by %s", (_case, one, other) => {
    expect(nicknameKey(other)).toBe(nicknameKey(one));
  });

  it("gives different keys to different nicknames", () => {
    expect(nicknameKey("Kelp Crew")).not.toBe(nicknameKey("Kelp Crows"));
  });

  it("knows the reserved names and leaves others alone", () => {
    expect(isReservedNickname("VIRTUAL GROUP 12")).toBe(true);
    expect(isReservedNickname("Virtuous Group")).toBe(false);
  });

  it("normalises to NFKC with single spaces", () => {
    expect(normaliseNickname(" ｆｉ  Crew ")).toBe("fi Crew");
  });
});
