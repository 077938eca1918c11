import "server-only";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { passwordProblem } from "@/domain/password-rules";
import { invalidField } from "./errors";

// Common passwords come from the list that ships in the npm package @zxcvbn-ts/language-common
// (src/passwords.json: about 49,000 passwords, most used first). It is read from node_modules
// when the package is installed; without it, only the short floor below and the rules in
// src/domain/password-rules.ts apply, and the server says so once in its log.
const LIST_PACKAGE = "@zxcvbn-ts/language-common";
const LIST_FILE = ["src", "passwords.json"];

/** Words every password list starts with; kept so the check means something without the package. */
const FLOOR = ["password", "passw0rd", "qwerty", "qwertyuiop", "letmein", "welcome", "iloveyou", "admin", "abc123", "monkey", "dragon", "sunshine", "trustno1", "changeme"];

const globalForPolicy = globalThis as unknown as { threadlineCommonPasswords?: Set<string> };

function loadCommonPasswords(): Set<string> {
  const words = new Set(FLOOR);
  const file = path.join(process.cwd(), "node_modules", ...LIST_PACKAGE.split("/"), ...LIST_FILE);
  try {
    if (existsSync(file)) {
      const list: unknown = JSON.parse(readFileSync(file, "utf8"));
      if (Array.isArray(list)) for (const word of list) if (typeof word === "string") words.add(word.toLowerCase());
      return words;
    }
  } catch (error) {
    console.error(`password policy: could not read ${file}`, error);
  }
  console.warn(`password policy: ${LIST_PACKAGE} is not installed; checking against the built-in floor of ${FLOOR.length} passwords only`);
  return words;
}

function commonPasswords(): Set<string> {
  globalForPolicy.threadlineCommonPasswords ??= loadCommonPasswords();
  return globalForPolicy.threadlineCommonPasswords;
}

export function isCommonPassword(word: string): boolean {
  return commonPasswords().has(word.toLowerCase());
}

/** Refuses an unsuitable password with a 422 naming `field`. */
export function assertPasswordAcceptable(password: string, person: { email: string; name: string }, field = "password"): void {
  const personalWords = [
    "threadline",
    ...person.email.split("@")[0].split(/[._+-]/),
    ...person.name.split(/\s+/),
  ].filter((word) => word.length >= 4);
  const problem = passwordProblem(password, { isListed: isCommonPassword, personalWords });
  if (problem) throw invalidField(field, problem);
}
