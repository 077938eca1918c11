// The rules that keep an operator from locking itself out: nobody changes their own role or
// deactivates themselves, and the last active administrator stays an active administrator.

export interface AccountState {
  id: string;
  role: string;
  status: "invited" | "active" | "deactivated";
}

export interface AccountChange {
  role?: string;
  status?: "active" | "deactivated";
}

export type AccountChangeProblem = { code: "own_account" | "last_admin"; message: string };

const isActiveAdmin = (account: AccountState) => account.role === "admin" && account.status === "active";

/**
 * Why `actorId` may not apply `change` to `target`, given every account that is an active admin now
 * (read under lock by the caller), or null when the change is allowed.
 */
export function accountChangeProblem(input: {
  actorId: string;
  target: AccountState;
  change: AccountChange;
  activeAdminIds: readonly string[];
}): AccountChangeProblem | null {
  const { actorId, target, change } = input;
  const changesRole = change.role !== undefined && change.role !== target.role;
  const deactivates = change.status === "deactivated" && target.status !== "deactivated";
  if (target.id === actorId && (changesRole || deactivates)) {
    return {
      code: "own_account",
      message: deactivates
        ? "You cannot deactivate your own account: ask another administrator."
        : "You cannot change your own role: ask another administrator.",
    };
  }
  const losesAdmin = isActiveAdmin(target) && ((changesRole && change.role !== "admin") || deactivates);
  if (losesAdmin) {
    const others = input.activeAdminIds.filter((id) => id !== target.id);
    if (others.length === 0) {
      return {
        code: "last_admin",
        message: `${deactivates ? "Deactivating" : "Demoting"} this account would leave no active administrator: make someone else an administrator first.`,
      };
    }
  }
  return null;
}
