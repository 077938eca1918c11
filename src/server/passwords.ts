import "server-only";
import { hash, verify } from "@node-rs/argon2";

// argon2id with the library's defaults (about 90 ms a hash here): slow enough to resist guessing.
export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// Verifying against this when no user matches keeps the answer time the same for unknown addresses.
let dummyHash: Promise<string> | null = null;
export async function burnVerifyTime(password: string): Promise<void> {
  dummyHash ??= hash("threadline-timing-equaliser");
  await verifyPassword(await dummyHash, password);
}
