import { describe, expect, it } from "vitest";
import { MIN_PASSWORD_LENGTH, passwordCandidates, passwordProblem } from "@/domain/password-rules";

// A stand-in for the shipped list of common passwords: the real list is loaded by the server.
const listed = new Set(["password", "qwertyuiop", "dragon", "letmein", "1qaz2wsx3edc", "sunshine"]);
const context = { isListed: (word: string) => listed.has(word), personalWords: ["kowalczyk", "threadline"] };

describe("passwordProblem", () => {
  it(`asks for at least ${MIN_PASSWORD_LENGTH} characters`, () => {
    expect(passwordProblem("short-pw", context)).toMatch(/at least 12 characters \(this one has 8\)/);
    expect(passwordProblem("a".repeat(300), context)).toMatch(/at most/);
  });

  it.each(["1qaz2wsx3edc", "1QAZ2WSX3EDC", "password1234", "Password!!2024", "!!!sunshine!!!", "letmeinletmein", "dragondragondragon"])(
    "refuses %s as a common password or a common password dressed up",
    (password) => {
      expect(passwordProblem(password, context)).toMatch(/commonly used passwords/);
    },
  );

  it("refuses repeated characters and digits only", () => {
    expect(passwordProblem("aaaaaaaaaaaa", context)).toMatch(/repeated/);
    expect(passwordProblem("abababababab", context)).toMatch(/repeated/);
    expect(passwordProblem("904871263519", context)).toMatch(/digits only/);
  });

  it("refuses a password that is mostly the person's name or the product's", () => {
    expect(passwordProblem("Kowalczyk2026", context)).toMatch(/name/);
    expect(passwordProblem("threadline!!1", context)).toMatch(/name/);
  });

  it("accepts a long, unlisted password", () => {
    expect(passwordProblem("Kestrel-lantern-ramp-29", context)).toBeNull();
    expect(passwordProblem("threadline plus my own long phrase", context)).toBeNull();
  });
});

describe("passwordCandidates", () => {
  it("checks the password, its core without digits and symbols, and the unit it repeats", () => {
    expect(passwordCandidates("Dragon2024!")).toEqual(["dragon2024!", "dragon"]);
    expect(passwordCandidates("abcabcabc")).toEqual(["abcabcabc", "abc"]);
  });
});
