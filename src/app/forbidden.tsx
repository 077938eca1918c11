import Link from "next/link";

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-xl p-6">
      <h1 className="text-2xl font-bold">Not available to your role</h1>
      <p className="mt-2">
        Your role may not open this page. If your work needs it, ask an administrator to review your role.
      </p>
      <Link href="/" className="btn btn-primary mt-4">
        Go to your home page
      </Link>
    </main>
  );
}
