import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg p-10 text-center" data-testid="not-found">
      <h1 className="text-xl font-semibold">Nothing here</h1>
      <p className="mt-2 text-sm text-slate-400">This page does not exist, or it belongs to a studio you are not a member of.</p>
      <Link href="/" className="mt-4 inline-block text-sm text-teal-300 hover:underline">Back to your studios</Link>
    </main>
  );
}
