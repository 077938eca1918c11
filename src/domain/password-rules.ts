// What makes a password acceptable: long enough, and not one of the passwords people pick most
// often (nor one of those with digits or symbols stuck on, nor one repeated).

export const MIN_PASSWORD_LENGTH = 12;
export const MAX_PASSWORD_LENGTH = 256;

export interface PasswordContext {
  /** True when the (lower-cased) word is on the list of commonly used passwords. */
  isListed(word: string): boolean;
  /** Words that must not make up the password: the person's e-mail name, the product name. */
  personalWords?: string[];
}

/** The forms of a password that are checked against the list. */
export function passwordCandidates(password: string): string[] {
  const lower = password.toLowerCase();
  const forms = new Set([lower]);
  const stripped = lower.replace(/^[\d\W_]+/, "").replace(/[\d\W_]+$/, "");
  if (stripped.length >= 4) forms.add(stripped);
  for (let size = 1; size <= lower.length / 2; size++) {
    if (lower.length % size === 0 && lower.slice(0, size).repeat(lower.length / size) === lower) {
      forms.add(lower.slice(0, size));
      break;
    }
  }
  return [...forms];
}

/** Null when the password may be used, otherwise what is wrong with it, phrased for the person choosing it. */
export function passwordProblem(password: string, context: PasswordContext): string | null {
  if (password.length < MIN_PASSWORD_LENGTH) {
    return `Use at least ${MIN_PASSWORD_LENGTH} characters (this one has ${password.length}). A few unrelated words make a long password easy to remember.`;
  }
  if (password.length > MAX_PASSWORD_LENGTH) return `Use at most ${MAX_PASSWORD_LENGTH} characters.`;
  const candidates = passwordCandidates(password);
  if (candidates.some((form) => form.length <= 2)) {
    return "This password is one or two characters repeated: choose something less predictable.";
  }
  if (/^\d+$/.test(password)) return "A password of digits only is easy to guess: add words.";
  if (candidates.some((form) => context.isListed(form))) {
    return "This password is on a list of commonly used passwords that attackers try first: choose another.";
  }
  const lower = password.toLowerCase();
  for (const word of context.personalWords ?? []) {
    const w = word.toLowerCase();
    if (w.length >= 4 && candidates.includes(w)) {
      return "This password is just your name, address or the product's name: choose something else.";
    }
    if (w.length >= 4 && lower.includes(w) && lower.length - w.length < 6) {
      return "This password is mostly your name, address or the product's name: add more of your own.";
    }
  }
  return null;
}
