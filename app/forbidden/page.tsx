import Link from "next/link";

export default function ForbiddenPage() {
  return (
    <main className="mx-auto max-w-md px-6 py-24">
      <h1 className="mb-2 text-lg font-semibold">Not available to your account</h1>
      <p className="text-sm text-ink-soft">
        That page belongs to another role or cohort. <Link href="/dashboard">Back to your dashboard</Link>.
      </p>
    </main>
  );
}
