import Link from "next/link";
import { AuthCard } from "./auth-card";

/** A mailed link that cannot be used: what happened and what to do, never an error trace. */
export function LinkRefusal({ title, message, retryHref, retryLabel }: { title: string; message: string; retryHref?: string; retryLabel?: string }) {
  return (
    <AuthCard title={title}>
      <p role="status" className="rounded-md border-2 border-[var(--ink-soft)] p-3">
        <span aria-hidden="true" className="mr-2 font-bold">
          ⊘
        </span>
        {message}
      </p>
      <div className="mt-5 flex flex-wrap gap-3">
        {retryHref ? (
          <Link href={retryHref} className="btn btn-primary">
            {retryLabel}
          </Link>
        ) : null}
        <Link href="/sign-in" className="btn btn-secondary">
          Go to sign-in
        </Link>
      </div>
    </AuthCard>
  );
}
