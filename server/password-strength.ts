import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as zxcvbnCommon from "@zxcvbn-ts/language-common";
import * as zxcvbnEnglish from "@zxcvbn-ts/language-en";

/** zxcvbn's score (0–4) a new password must reach: 3 is "safely unguessable" against an offline slow-hash attack. */
export const MIN_PASSWORD_SCORE = 3;

// The common-password, diceware and English word lists; built once, as the dictionaries take a moment to rank.
const strength = new ZxcvbnFactory({
  dictionary: { ...zxcvbnCommon.dictionary, ...zxcvbnEnglish.dictionary },
  graphs: zxcvbnCommon.adjacencyGraphs,
  translations: zxcvbnEnglish.translations,
});

/**
 * Why a new password is too easy to guess, or null: zxcvbn-ts's estimate against common and leaked-password lists,
 * words, keyboard patterns, repeats and the teacher's own name and address (Wheeler, "zxcvbn: Low-Budget Password
 * Strength Estimation", USENIX Security 2016).
 */
export function passwordWeakness(password: string, personal: string[]): string | null {
  const result = strength.check(password, [
    ...personal.flatMap((text) => text.toLowerCase().split(/[\s@.]+/)).filter((word) => word.length > 2),
    "outroll",
  ]);
  if (result.score >= MIN_PASSWORD_SCORE) return null;
  const hints = [result.feedback.warning, ...result.feedback.suggestions].filter((hint): hint is string => Boolean(hint));
  return `This password is too easy to guess.${hints.length ? ` ${hints.join(" ")}` : ""} Three or four unrelated words make a strong one.`;
}
