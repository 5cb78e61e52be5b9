import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-6 py-24 text-center">
      <p className="font-mono text-xs uppercase tracking-widest text-ink-faint">404</p>
      <h1 className="mt-2 text-2xl font-semibold">Nothing here</h1>
      <p className="mt-3 text-sm text-ink-muted">
        The page does not exist, or it belongs to a workspace you are not in.
      </p>
      <Link href="/" className="mt-6 inline-block text-sm text-accent underline underline-offset-2">
        Back to the start
      </Link>
    </main>
  );
}
