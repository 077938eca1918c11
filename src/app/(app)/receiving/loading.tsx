export default function Loading() {
  return <p role="status" className="p-4">Loading the receiving form…</p>;
}
