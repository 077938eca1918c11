export default function Loading() {
  return (
    <p role="status" className="p-4 text-lg">
      Computing the rates…
    </p>
  );
}
