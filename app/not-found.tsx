import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl p-10">
      <h1 className="text-2xl font-semibold">Not found</h1>
      <p className="mt-2 text-muted">
        That page or record does not exist, or you are not a member of its project.
      </p>
      <Link href="/projects" className="mt-4 inline-block text-accent underline">
        Back to your projects
      </Link>
    </main>
  );
}
