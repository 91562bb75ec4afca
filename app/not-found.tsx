import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-4 py-16 text-center">
      <h1 className="page-title">Not found</h1>
      <p className="mt-2 text-sm text-ink-soft">There is no such page, or it belongs to a site you are not a member of.</p>
      <Link href="/" className="btn-quiet mt-6">Back to your sites</Link>
    </main>
  );
}
