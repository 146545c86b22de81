import type { Metadata } from 'next';
import Link from '@/components/link';
import { BoatForm } from '../boat-form';

export const metadata: Metadata = { title: 'Register a boat' };

export default function NewBoatPage() {
  return (
    <div className="max-w-xl space-y-5">
      <p>
        <Link href="/boats">← My boats</Link>
      </p>
      <h1>Register a boat</h1>
      <p className="text-ink-soft">
        Declare the boat as it will race. Scrutineers measure the nozzle and check the rest at inspection; what you
        write here is your declaration, kept with every later change.
      </p>
      <div className="card">
        <BoatForm />
      </div>
    </div>
  );
}
