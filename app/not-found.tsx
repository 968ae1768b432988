import Link from "next/link";

export default function NotFound() {
  return (
    <>
      <h1>Not found</h1>
      <p>There is no such page or record; it may have been deleted.</p>
      <p>
        <Link href="/fuels">Back to the fuel library</Link>
      </p>
    </>
  );
}
