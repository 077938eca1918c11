import Link from "next/link";
import type { ReactNode } from "react";
import { LogoMark } from "@/components/shell/logo";
import { MainNav } from "@/components/shell/main-nav";
import { ThemeToggle } from "@/components/shell/theme-toggle";
import { navFor, ROLE_LABELS } from "@/lib/roles";
import { requireUserFor } from "@/server/page-guard";
import { signOutAction } from "./sign-out-action";

export default async function SignedInLayout({ children }: { children: ReactNode }) {
  const user = await requireUserFor("home");
  return (
    <div className="flex min-h-dvh flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-white focus:p-2">
        Skip to content
      </a>
      <header className="no-print relative bg-thread-800 text-white">
        <div className="mx-auto flex max-w-screen-2xl flex-wrap items-center gap-3 px-3 py-2">
          <Link href="/" className="flex min-h-touch items-center gap-2 text-lg font-bold">
            <LogoMark /> <span>Threadline</span>
          </Link>
          <MainNav items={navFor(user.role)} />
          <div className="ml-auto flex items-center gap-2">
            <p className="hidden text-right text-sm leading-tight sm:block">
              <span className="block font-semibold">{user.name}</span>
              <span className="block">{ROLE_LABELS[user.role]}</span>
            </p>
            <ThemeToggle />
            <form action={signOutAction}>
              <button type="submit" className="btn btn-secondary border-white/60 text-white">
                Sign out
              </button>
            </form>
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-screen-2xl flex-1 px-3 py-4 sm:px-5">
        {children}
      </main>
    </div>
  );
}
