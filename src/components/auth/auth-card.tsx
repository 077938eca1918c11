import type { ReactNode } from "react";
import { LogoMark } from "@/components/shell/logo";

/** The centred panel of the pages outside the signed-in shell (sign-in, invitation, password reset). */
export function AuthCard({ title, intro, children }: { title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <main className="flex min-h-dvh items-center justify-center p-4">
      <div className="panel w-full max-w-md p-6 shadow-sm">
        <div className="mb-6 flex items-center gap-3 text-[var(--accent)]">
          <LogoMark className="h-9 w-auto" />
          <span className="text-2xl font-bold">Threadline</span>
        </div>
        <h1 className="mb-1 text-xl font-bold">{title}</h1>
        {intro ? <div className="mb-5 text-[var(--ink-soft)]">{intro}</div> : null}
        {children}
      </div>
    </main>
  );
}
