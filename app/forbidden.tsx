import Link from "next/link";

export default function Forbidden() {
  return (
    <div className="mx-auto max-w-xl py-10">
      <p className="text-sm font-semibold uppercase tracking-wide text-accent">Error 403</p>
      <h1 className="mb-2 text-3xl font-bold">This page is not for your role</h1>
      <p className="mb-4 text-muted">You are signed in, but your account does not have access here. If you think it should, ask your school&apos;s Meniscus admin.</p>
      <Link href="/">Go to your home page</Link>
    </div>
  );
}
