import Link from "next/link";
import { ROLE_LABELS } from "@/lib/roles";
import { ROLE_TASKS } from "@/lib/role-tasks";
import { requireUserFor } from "@/server/page-guard";

export default async function HomePage() {
  const user = await requireUserFor("home", "/");
  const tasks = ROLE_TASKS[user.role];
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-bold">Good to see you, {user.name.split(" ")[0]}</h1>
        <p className="text-[var(--ink-soft)]">
          Signed in as {ROLE_LABELS[user.role]}
          {user.licenceNumber ? (
            <>
              {" "}· licence <span className="num">{user.licenceNumber}</span>
            </>
          ) : null}
        </p>
      </div>
      <section aria-labelledby="next-heading">
        <h2 id="next-heading" className="mb-3 text-lg font-semibold">
          What you can do next
        </h2>
        <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {tasks.map((task) => (
            <li key={task.title}>
              <Link href={task.href} className="panel block h-full p-4 hover:border-[var(--accent)]">
                <span className="block text-lg font-semibold text-[var(--accent)]">{task.title} →</span>
                <span className="mt-1 block">{task.detail}</span>
              </Link>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
