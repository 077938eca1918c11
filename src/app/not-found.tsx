import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl p-6">
      <h1 className="text-2xl font-bold">Not found</h1>
      <p className="mt-2">There is nothing at this address. It may have been mistyped, or the record does not exist.</p>
      <Link href="/" className="btn btn-primary mt-4">
        Go to your home page
      </Link>
    </main>
  );
}
