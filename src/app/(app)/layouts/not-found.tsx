import Link from "next/link";

export default function LayoutNotFound() {
  return (
    <div className="panel max-w-xl p-4">
      <h1 className="text-xl font-bold">No such aircraft type or position</h1>
      <p className="mt-2">It may have been mistyped in the address. Pick the type from the list instead.</p>
      <Link href="/layouts" className="btn btn-primary mt-4">
        Go to the layouts
      </Link>
    </div>
  );
}
