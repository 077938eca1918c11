import "server-only";

// mysql2 driver errors the account code answers with a readable refusal instead of a 500.
export const isDuplicateKey = (error: unknown) => (error as { errno?: number })?.errno === 1062;
export const isLockConflict = (error: unknown) => [1205, 1213].includes((error as { errno?: number })?.errno ?? 0);
