import type { Metadata } from "next";
import Link from "next/link";
import { AircraftTypeForm } from "@/components/layouts/aircraft-type-form";
import { listAircraftTypes } from "@/server/layouts";
import { requireUserFor } from "@/server/page-guard";
import { createAircraftTypeAction } from "./actions";

export const metadata: Metadata = { title: "Layouts" };

export default async function LayoutsPage() {
  await requireUserFor("layouts", "/layouts");
  const types = await listAircraftTypes();
  return (
    <div className="max-w-4xl space-y-4">
      <h1 className="text-2xl font-bold">Layouts</h1>
      <p>
        Each aircraft type&apos;s positions: where they sit on the map, their cautions and which part numbers may be fitted. <span className="num">{types.length}</span>{" "}
        types.
      </p>
      <table className="panel w-full border-collapse text-left">
        <thead>
          <tr className="border-b-2 border-[var(--ink-soft)]">
            <th scope="col" className="px-3 py-2">Type</th>
            <th scope="col" className="px-3 py-2">Name</th>
            <th scope="col" className="px-3 py-2 text-right">Positions</th>
          </tr>
        </thead>
        <tbody>
          {types.map((type) => (
            <tr key={type.code} className="border-b border-[var(--rule)]">
              <td className="px-3 py-2">
                <Link href={`/layouts/${encodeURIComponent(type.code)}`} className="num inline-flex min-h-touch items-center font-semibold text-[var(--accent)] underline">
                  {type.code}
                </Link>
              </td>
              <td className="px-3 py-2">{type.name}</td>
              <td className="num px-3 py-2 text-right">{type.positionCount}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <AircraftTypeForm action={createAircraftTypeAction} />
    </div>
  );
}
