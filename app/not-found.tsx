import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg p-6">
      <h1 className="mb-2 text-2xl font-bold">Not found</h1>
      <p className="mb-4">This page does not exist, or it belongs to a site you do not have a role on.</p>
      <Link href="/sites" className="font-semibold text-brand underline">
        Back to your sites
      </Link>
    </main>
  );
}
