import type { Metadata } from "next";
import Link from "next/link";
import { formatCycles, formatInstant } from "@/lib/format";
import { countOpenFindingsByAircraft, listFleet } from "@/server/aircraft";
import { requireUserFor } from "@/server/page-guard";

export const metadata: Metadata = { title: "Fleet" };

export default async function FleetPage() {
  await requireUserFor("fleet", "/fleet");
  const [fleet, findings] = await Promise.all([listFleet(), countOpenFindingsByAircraft()]);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Fleet</h1>
      <p className="num text-sm">{fleet.length} aircraft</p>
      <div className="panel overflow-x-auto">
        <table className="w-full border-collapse">
          <thead className="bg-[var(--panel)] text-left">
            <tr>
              <th scope="col" className="px-3 py-2">Registration</th>
              <th scope="col" className="px-3 py-2">Type</th>
              <th scope="col" className="px-3 py-2">MSN</th>
              <th scope="col" className="px-3 py-2">Station</th>
              <th scope="col" className="px-3 py-2 text-right">Hours</th>
              <th scope="col" className="px-3 py-2 text-right">Cycles</th>
              <th scope="col" className="px-3 py-2">As of</th>
              <th scope="col" className="px-3 py-2 text-right">Open findings</th>
            </tr>
          </thead>
          <tbody>
            {fleet.map((a) => (
              <tr key={a.registration} className="border-t border-[var(--rule)]">
                <td className="px-3 py-1">
                  <Link href={`/aircraft/${a.registration}`} className="num flex min-h-touch items-center text-lg font-bold text-[var(--accent)] underline-offset-4 hover:underline">
                    {a.registration}
                  </Link>
                </td>
                <td className="px-3 py-1">
                  <span className="num">{a.type}</span> {a.typeName}
                </td>
                <td className="num px-3 py-1">{a.msn}</td>
                <td className="px-3 py-1">
                  <span className="num">{a.station}</span> {a.stationName}
                </td>
                <td className="num px-3 py-1 text-right">{a.hours}</td>
                <td className="num px-3 py-1 text-right">{formatCycles(a.cycles)}</td>
                <td className="px-3 py-1 text-sm">{formatInstant(a.asOf, a.timeZone)}</td>
                <td className="num px-3 py-1 text-right">
                  {findings.get(a.id) ? (
                    <span className="font-bold text-purple-900 dark:text-purple-200">
                      <span aria-hidden="true">◆</span> {findings.get(a.id)}
                    </span>
                  ) : (
                    "0"
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
