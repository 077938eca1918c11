import Link from "next/link";

export default function PartNumberNotFound() {
  return (
    <div className="panel max-w-xl p-4">
      <h1 className="text-xl font-bold">No such part number</h1>
      <p className="mt-2">It may have been mistyped in the address. Search the catalog for it instead.</p>
      <Link href="/catalog" className="btn btn-primary mt-4">
        Go to the catalog
      </Link>
    </div>
  );
}
