import Link from "next/link";

export default function NotFound() {
  return (
    <div className="mx-auto max-w-xl py-10">
      <p className="text-sm font-semibold uppercase tracking-wide text-accent">Error 404</p>
      <h1 className="mb-2 text-3xl font-bold">We could not find that page</h1>
      <p className="mb-4 text-muted">It may have moved, or you may not have access to it.</p>
      <Link href="/">Go to your home page</Link>
    </div>
  );
}
