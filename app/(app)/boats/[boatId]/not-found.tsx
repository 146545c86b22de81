import Link from '@/components/link';

// Another person's boat reads exactly like a missing one.
export default function BoatNotFound() {
  return (
    <div className="card space-y-3">
      <h1 className="text-2xl">No such boat among yours</h1>
      <p>The link may be mistyped, or the boat belongs to someone else.</p>
      <Link href="/boats" className="btn-primary">
        My boats
      </Link>
    </div>
  );
}
