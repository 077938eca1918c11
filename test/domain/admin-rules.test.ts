import { describe, expect, it } from "vitest";
import { accountChangeProblem, type AccountState } from "@/domain/admin-rules";

const adminA: AccountState = { id: "a", role: "admin", status: "active" };
const adminB: AccountState = { id: "b", role: "admin", status: "active" };
const technician: AccountState = { id: "t", role: "technician", status: "active" };

describe("accountChangeProblem", () => {
  it("refuses changing one's own role or deactivating oneself", () => {
    const ids = ["a", "b"];
    expect(accountChangeProblem({ actorId: "a", target: adminA, change: { role: "auditor" }, activeAdminIds: ids })?.code).toBe("own_account");
    expect(accountChangeProblem({ actorId: "a", target: adminA, change: { status: "deactivated" }, activeAdminIds: ids })?.message).toMatch(
      /deactivate your own account/,
    );
  });

  it("lets a person keep their own role and status (editing their licence, say)", () => {
    expect(accountChangeProblem({ actorId: "a", target: adminA, change: { role: "admin", status: "active" }, activeAdminIds: ["a"] })).toBeNull();
  });

  it("allows demoting or deactivating an admin while another active admin remains", () => {
    expect(accountChangeProblem({ actorId: "a", target: adminB, change: { role: "stores" }, activeAdminIds: ["a", "b"] })).toBeNull();
    expect(accountChangeProblem({ actorId: "a", target: adminB, change: { status: "deactivated" }, activeAdminIds: ["a", "b"] })).toBeNull();
  });

  it("refuses demoting or deactivating the last active admin", () => {
    // The acting account is no longer counted (it lost its role while this request waited for the lock).
    expect(accountChangeProblem({ actorId: "x", target: adminB, change: { role: "stores" }, activeAdminIds: ["b"] })?.code).toBe("last_admin");
    expect(accountChangeProblem({ actorId: "x", target: adminB, change: { status: "deactivated" }, activeAdminIds: ["b"] })?.message).toMatch(
      /leave no active administrator/,
    );
  });

  it("does not count invited or deactivated admins, and does not guard accounts that are not active admins", () => {
    const invitedAdmin: AccountState = { id: "i", role: "admin", status: "invited" };
    expect(accountChangeProblem({ actorId: "a", target: invitedAdmin, change: { status: "deactivated" }, activeAdminIds: [] })).toBeNull();
    expect(accountChangeProblem({ actorId: "a", target: technician, change: { role: "inspector" }, activeAdminIds: [] })).toBeNull();
  });

  it("treats promoting to admin and reactivating as safe", () => {
    const deactivated: AccountState = { id: "d", role: "admin", status: "deactivated" };
    expect(accountChangeProblem({ actorId: "a", target: deactivated, change: { status: "active" }, activeAdminIds: ["a"] })).toBeNull();
    expect(accountChangeProblem({ actorId: "a", target: technician, change: { role: "admin" }, activeAdminIds: ["a"] })).toBeNull();
  });
});
