import Link from "next/link";

export default function PersonNotFound() {
  return (
    <div className="mx-auto max-w-xl space-y-3">
      <h1 className="text-2xl font-bold">No such person</h1>
      <p>No account has this address. It may have been mistyped; find the person on the People page.</p>
      <Link href="/people" className="btn btn-primary">
        Go to People
      </Link>
    </div>
  );
}
