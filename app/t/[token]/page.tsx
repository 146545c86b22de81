import type { Metadata } from 'next';
import Link from '@/components/link';
import { format, parseISO } from 'date-fns';
import { redirect } from 'next/navigation';
import { CardPage } from '@/components/card-page';
import { getActor } from '@/lib/server/auth/actor';
import { describeTag } from '@/lib/server/boats/describe-tag';
import { findTagDestination, type OfficialMeeting } from '@/lib/server/tags/tag-destination';

// The page a boat's QR tag opens (a phone's own camera lands here). Signed in, the owner goes to
// their boat and a scrutineer of a meeting where the boat is entered to its card at the dock;
// everyone else sees the public card: the boat's name and race numbers only.
export const metadata: Metadata = { title: 'Boat tag', robots: { index: false, follow: false } };
export const dynamic = 'force-dynamic';

export default async function TagLandingPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const actor = await getActor();
  const destination = actor ? await findTagDestination(actor, token) : null;
  if (destination?.redirectTo) redirect(destination.redirectTo);
  const officialAt: OfficialMeeting[] = destination && 'officialAt' in destination ? destination.officialAt : [];
  const tag = await describeTag(token);
  return (
    <CardPage className="space-y-4" data-testid="tag-landing" data-tag-state={tag.state}>
      {tag.state === 'current' && (
        <>
          <p className="text-sm font-bold uppercase tracking-widest text-pass-600">Current tag</p>
          <h1 data-testid="tag-boat-name">{tag.boatName}</h1>
          {tag.upcoming.length === 0 ? (
            <p className="text-ink-soft">Not entered at any upcoming meeting.</p>
          ) : (
            <ul className="divide-y divide-paper-line">
              {tag.upcoming.map((u) => (
                <li key={`${u.eventName}-${u.raceNumber}`} className="flex items-center justify-between gap-3 py-3">
                  <span>
                    <span className="font-bold">{u.eventName}</span>
                    <span className="block text-sm text-ink-soft">
                      {u.venue} · {format(parseISO(u.startsOn), 'd MMM yyyy')} · {u.className}
                    </span>
                  </span>
                  <span className="figure text-3xl font-bold" aria-label={`race number ${u.raceNumber}`}>
                    {u.raceNumber}
                  </span>
                </li>
              ))}
            </ul>
          )}
          {officialAt.map((m) => (
            <section key={m.eventId} className="space-y-2 rounded-lg bg-tide-50 p-3" data-testid="tag-official-links">
              <p>
                <strong>You are an official at {m.eventName}</strong>, where this boat races as number {m.raceNumber}:
              </p>
              <ul className="flex flex-wrap gap-2">
                {m.links.map((l) => (
                  <li key={l.href}>
                    <Link href={l.href} className="btn-secondary">
                      {l.label}
                    </Link>
                  </li>
                ))}
              </ul>
            </section>
          ))}
          {!actor ? (
            <p className="rounded-lg bg-tide-50 p-3">
              <strong>Scrutineers and officials:</strong>{' '}
              <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`/t/${token}`)}`}>sign in</Link> to see this
              boat&apos;s declaration and record an inspection.
            </p>
          ) : (
            officialAt.length === 0 && (
              <p className="rounded-lg bg-paper-deep p-3" data-testid="tag-signed-in-note">
                You are signed in as {actor.name ?? actor.email}. This boat is not entered at a meeting still to come
                where you inspect boats, so this card is all the tag shows you. <Link href="/home">Your home page</Link>
              </p>
            )
          )}
        </>
      )}
      {tag.state === 'retired' && (
        <>
          <p className="text-sm font-bold uppercase tracking-widest text-fail-600">Replaced tag</p>
          <h1 className="text-2xl" data-testid="tag-retired">
            This tag was replaced on {format(parseISO(tag.retiredAt), 'd MMM yyyy')}: it is no longer valid
          </h1>
          <p>
            It belonged to <strong>{tag.boatName}</strong>. Look for the boat&apos;s new tag, or ask the team to show
            it.
          </p>
        </>
      )}
      {tag.state === 'unknown' && (
        <>
          <h1 className="text-2xl" data-testid="tag-unknown">
            This is not a Boreline tag we know
          </h1>
          <p>The code may be damaged or from another system. Ask the boat&apos;s team or the chief scrutineer.</p>
        </>
      )}
    </CardPage>
  );
}
