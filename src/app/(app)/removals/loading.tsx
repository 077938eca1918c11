export default function Loading() {
  return (
    <p role="status" className="p-4 text-lg">
      Loading the removal history…
    </p>
  );
}
