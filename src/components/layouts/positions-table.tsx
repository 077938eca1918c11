import Link from "next/link";
import type { PositionView } from "@/lib/schemas/layouts";

/** A type's positions, dense for the desk: the code opens the position's page. */
export function PositionsTable({ typeCode, positions }: { typeCode: string; positions: PositionView[] }) {
  return (
    <div className="panel max-h-[70vh] overflow-auto">
      <table className="w-full border-collapse text-left text-[15px]">
        <thead className="sticky top-0 z-10 bg-[var(--panel)] shadow-[0_2px_0_var(--ink-soft)]">
          <tr>
            <th scope="col" className="px-3 py-2">Code</th>
            <th scope="col" className="px-3 py-2">Label</th>
            <th scope="col" className="px-3 py-2">Parent</th>
            <th scope="col" className="px-3 py-2">ATA</th>
            <th scope="col" className="px-3 py-2">Zone</th>
            <th scope="col" className="px-3 py-2 text-right">x</th>
            <th scope="col" className="px-3 py-2 text-right">y</th>
            <th scope="col" className="px-3 py-2">Independent inspection</th>
            <th scope="col" className="px-3 py-2 text-right">Cautions</th>
            <th scope="col" className="px-3 py-2">Eligible P/Ns</th>
          </tr>
        </thead>
        <tbody>
          {positions.map((p) => (
            <tr key={p.code} className="border-b border-[var(--rule)] hover:bg-thread-50 dark:hover:bg-thread-900">
              <td className="px-3 py-1.5">
                <Link href={`/layouts/${encodeURIComponent(typeCode)}/${encodeURIComponent(p.code)}`} className="num whitespace-nowrap font-semibold text-[var(--accent)] underline">
                  {p.code}
                </Link>
              </td>
              <td className="px-3 py-1.5">{p.label}</td>
              <td className="num whitespace-nowrap px-3 py-1.5">{p.parentCode ?? "—"}</td>
              <td className="num whitespace-nowrap px-3 py-1.5">{p.ataChapter}</td>
              <td className="px-3 py-1.5">{p.zone ?? "—"}</td>
              <td className="num px-3 py-1.5 text-right">{p.x}</td>
              <td className="num px-3 py-1.5 text-right">{p.y}</td>
              <td className="px-3 py-1.5">
                {p.requiresIndependentInspection ? (
                  <span className="font-semibold">
                    <span aria-hidden="true">◆ </span>Required
                  </span>
                ) : (
                  <span>
                    <span aria-hidden="true">◇ </span>Not required
                  </span>
                )}
              </td>
              <td className="num px-3 py-1.5 text-right">{p.cautions.length}</td>
              <td className="num px-3 py-1.5">
                {p.eligible.length ? (
                  <ul>
                    {p.eligible.map((e) => (
                      <li key={e.id} className="whitespace-nowrap">
                        {e.partNumber}
                      </li>
                    ))}
                  </ul>
                ) : (
                  "none"
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
