import type { Metadata } from "next";
import Link from "next/link";
import { requireUserFor } from "@/server/page-guard";
import { listStations } from "@/server/users";
import { InviteForm } from "./invite-form";

export const metadata: Metadata = { title: "Invite a person" };

export default async function InvitePage() {
  await requireUserFor("people", "/people/invite");
  const stations = await listStations();
  return (
    <div className="mx-auto max-w-2xl space-y-4">
      <p>
        <Link href="/people" className="inline-flex min-h-touch items-center font-semibold text-[var(--accent)] underline">
          ← People
        </Link>
      </p>
      <h1 className="text-2xl font-bold">Invite a person</h1>
      <p>
        Threadline mails them a link that works once, for 48 hours. With it they choose their own password and are signed in. Sending it
        again later replaces the link.
      </p>
      <InviteForm stations={stations} />
    </div>
  );
}
