import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { LogoMark } from "@/components/shell/logo";
import { validateRequest } from "@/server/auth";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  const { next } = await searchParams;
  const { user } = await validateRequest();
  if (user) redirect(next?.startsWith("/") && !next.startsWith("//") ? next : "/");
  return (
    <main className="flex min-h-dvh items-center justify-center p-4">
      <div className="panel w-full max-w-md p-6 shadow-sm">
        <div className="mb-6 flex items-center gap-3 text-[var(--accent)]">
          <LogoMark className="h-9 w-auto" />
          <span className="text-2xl font-bold">Threadline</span>
        </div>
        <h1 className="mb-1 text-xl font-bold">Sign in</h1>
        <p className="mb-5 text-[var(--ink-soft)]">Component changes and serial traceability for line maintenance.</p>
        <SignInForm next={next ?? "/"} />
        <p className="mt-4">
          <Link href="/reset-password" className="inline-flex min-h-touch items-center font-semibold text-[var(--accent)] underline">
            Forgot password?
          </Link>
        </p>
      </div>
    </main>
  );
}
