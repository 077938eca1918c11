export default function PeopleLoading() {
  return (
    <p role="status" className="p-4 font-semibold">
      Loading people…
    </p>
  );
}
