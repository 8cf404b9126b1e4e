import { DataSet, englishDataset, englishRecommendedTransformers, RegExpMatcher } from "obscenity";
import unhomoglyph from "unhomoglyph";
// The lengths live beside the join code schema, which the Roll pad loads without this file's word lists.
import { NICKNAME_MAX, NICKNAME_MIN } from "../schemas/joining";

export { NICKNAME_MAX, NICKNAME_MIN };

/** The names the virtual class's groups take ("Virtual group 3"); no pupil's group may take one or a look-alike. */
export const VIRTUAL_GROUP_PREFIX = "Virtual group";

// Innocent place names that hold a rude word inside, which the word filter's English list would otherwise refuse.
const innocentPlaceNames = [
  "penistone",
  "cumnock",
  "cumbernauld",
  "scunthorpe",
  "clitheroe",
  "shitterton",
  "twatt",
  "wankie",
  "bitchfield",
];

const rudeWords = new RegExpMatcher({
  ...new DataSet<{ originalWord?: string }>()
    .addAll(englishDataset)
    .addPhrase((phrase) => innocentPlaceNames.reduce((builder, name) => builder.addWhitelistedTerm(name), phrase))
    .build(),
  ...englishRecommendedTransformers,
});

/**
 * Common first names of pupils in English schools, our own short list: a nickname made of one of these and a
 * capitalised second word ("Emily Carter") looks like a real pupil's name, which a class run must not keep.
 */
const givenNames = new Set(
  (
    "oliver george harry jack noah leo arthur oscar charlie muhammad mohammed jacob freddie alfie theo thomas william henry " +
    "james joshua ethan lucas isaac archie max samuel daniel joseph adam logan dylan ryan liam tyler kai riley reuben " +
    "olivia amelia isla ava mia ivy lily isabella rosie sophia grace freya evie poppy ella emily sophie ruby florence " +
    "willow millie chloe jessica hannah amy sarah lucy holly aisha maya zara layla fatima ellie daisy megan emma " +
    "alice charlotte matilda eva lola phoebe harper zainab yusuf ibrahim omar ali hassan priya anya leah katie jade"
  ).split(" "),
);

// Characters that are invisible or change the direction text is drawn in (Unicode general categories Cc and Cf:
// controls, zero-width spaces and joiners, the byte order mark, bidi embeddings, overrides and isolates).
const invisibleCharacters = /[\p{Cc}\p{Cf}]/u;

/** A nickname as stored: NFKC-normalised (full-width and styled letters become plain ones), trimmed, single spaces. */
export function normaliseNickname(nickname: string): string {
  return nickname.normalize("NFKC").trim().replace(/\s+/g, " ");
}

/**
 * The nickname's confusable skeleton (Unicode TR39 confusables through `unhomoglyph`), lower-cased, without spaces or
 * punctuation: two nicknames with the same key look alike on the Run board ("Kelp Crew", "KeIp Сrew", "kelp-crew").
 */
export function nicknameKey(nickname: string): string {
  // Mapped before and after lower-casing; then i, l and 1 are one letter, since a capital I passes for a small l.
  return unhomoglyph(unhomoglyph(normaliseNickname(nickname)).toLowerCase())
    .toLowerCase()
    .replace(/[il1|]/g, "l")
    .replace(/[\s'.&?!-]+/g, "");
}

const virtualGroupKey = nicknameKey(VIRTUAL_GROUP_PREFIX);

/** Whether a nickname is, or looks like, one of the virtual class's reserved names. */
export function isReservedNickname(nickname: string): boolean {
  return nicknameKey(nickname).startsWith(virtualGroupKey);
}

function soundsRude(text: string): boolean {
  // A word of digits alone is a number ("Group 717"), not letters in disguise.
  const plain = text
    .split(" ")
    .filter((word) => /\p{L}/u.test(word))
    .join(" ")
    .toLowerCase();
  const skeleton = unhomoglyph(plain).toLowerCase();
  // Also read with the spaces and punctuation taken out, so "f u c k" or "p.e.n.i.s" is read as one word.
  return [plain, skeleton].some((candidate) => rudeWords.hasMatch(candidate) || rudeWords.hasMatch(candidate.replace(/[\s'.&?!-]+/g, "")));
}

/** Whether the nickname looks like a pupil's first name and surname. */
function looksLikeRealName(text: string): boolean {
  const words = text.split(" ");
  if (words.length !== 2) return false;
  const [first, last] = words;
  return givenNames.has(first.toLowerCase()) && /^\p{Lu}[\p{Ll}'-]+$/u.test(last);
}

/**
 * Why a group nickname is refused, or null when it is fine: its length, invisible or direction-changing characters,
 * things that look like personal data (an e-mail, a phone number, a first name and surname), rude words (the
 * `obscenity` English list with its recommended transformers, also read as confusable skeletons and with the spaces
 * taken out), and the virtual class's reserved names. Look-alikes of the run's other groups are the server's check.
 */
export function nicknameProblem(nickname: string): string | null {
  if (invisibleCharacters.test(nickname)) return "Use visible letters only: the nickname has an invisible or direction-changing character.";
  const text = normaliseNickname(nickname);
  if ([...text].length < NICKNAME_MIN) return `A group nickname needs at least ${NICKNAME_MIN} characters.`;
  if ([...text].length > NICKNAME_MAX) return `Keep the group nickname to ${NICKNAME_MAX} characters or fewer.`;
  if (/\S+@\S+/.test(text)) return "That looks like an e-mail address. Choose a made-up group nickname instead.";
  if ((text.match(/\d/g) ?? []).length >= 5) return "That looks like a phone number. Choose a made-up group nickname without long numbers.";
  if (/(https?:|www\.|\.(com|net|org|uk|io)\b)/i.test(text)) return "Web addresses are not nicknames. Choose a made-up group nickname.";
  if (/[#/\\<>{}[\]=_^~`|"]/.test(text)) return "Use letters, numbers, spaces and simple punctuation ( ' - ! ? . & ) only.";
  if (soundsRude(text)) return "Please choose a friendlier nickname.";
  if (looksLikeRealName(text)) return "No real names: choose a made-up group nickname, not a pupil's first name and surname.";
  if (isReservedNickname(text)) return `“${VIRTUAL_GROUP_PREFIX}” names belong to the virtual class. Choose another nickname.`;
  return null;
}
