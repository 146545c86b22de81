import type { Metadata } from 'next';
import Link from '@/components/link';
import { notFound, redirect } from 'next/navigation';
import { format, parseISO } from 'date-fns';
import QRCode from 'qrcode';
import { getActor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { getMyBoat } from '@/lib/server/boats/get-my-boat';
import { listBoatComponents } from '@/lib/server/components/list-my-components';
import { convertPower } from '@/lib/core/engine/units';
import { formatFigure } from '@/lib/core/entries/check-declaration';
import { formatFigure as formatPowerFigure } from '@/lib/core/format/figures';
import { POWER_EVIDENCE } from '@/lib/core/constants';
import { DOCUMENT_KINDS } from '@/lib/core/inputs/boats';
import { BoatForm } from '../boat-form';
import { DocumentUploadForm } from './document-upload-form';
import { ReissueTagButton } from './reissue-tag-button';
import { ComponentsSection } from './components-section';
import { PerformanceForm } from './performance-form';
import { listPumpCatalogue } from '@/lib/server/boats/list-pump-catalogue';
import { describePerformance } from '@/lib/core/boats/declared-performance';

export const metadata: Metadata = { title: 'Boat' };
export const dynamic = 'force-dynamic';

const sizeText = (n: number) =>
  n >= 1024 * 1024 ? `${(n / 1024 / 1024).toFixed(1)} MB` : `${Math.max(1, Math.round(n / 1024))} KB`;

export default async function BoatPage({ params }: { params: Promise<{ boatId: string }> }) {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const { boatId } = await params;
  const mine = await getMyBoat(actor, boatId).catch((err) => {
    if (err instanceof AppError && err.status === 404) notFound();
    throw err;
  });
  const { boat, documents, tag, entries, declarationVersions } = mine;
  const [components, catalogue] = await Promise.all([listBoatComponents(actor, boat.id), listPumpCatalogue(actor)]);
  // Error correction M survives a scuffed sticker; margin 2 modules keeps the quiet zone (ISO/IEC 18004).
  const qr = await QRCode.toDataURL(tag.url, { errorCorrectionLevel: 'M', margin: 2, width: 320 });
  const row = (label: string, value: React.ReactNode) => (
    <>
      <dt className="font-bold">{label}</dt>
      <dd className="mb-2 sm:mb-0">{value || <span className="text-ink-mute">—</span>}</dd>
    </>
  );

  return (
    <div className="space-y-6">
      <p>
        <Link href="/boats">← My boats</Link>
      </p>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 data-testid="boat-name">
          {boat.name}
          {boat.hullNumber && <span className="figure ml-2 text-2xl text-ink-mute">#{boat.hullNumber}</span>}
        </h1>
        <Link href={`/boats/${boat.id}/logbook`} className="btn-secondary">
          Logbook
        </Link>
        <Link href={`/boats/${boat.id}/enter`} className="btn-primary">
          Enter a meeting
        </Link>
      </div>

      {entries.length > 0 && (
        <section className="card space-y-2" aria-labelledby="entered-at">
          <h2 id="entered-at" className="text-xl">
            Entered at
          </h2>
          <ul className="divide-y divide-paper-line">
            {entries.map((e) => (
              <li key={e.id} className="flex flex-wrap justify-between gap-2 py-2">
                <span>
                  {e.eventName} · {e.classCode} {e.className} · {format(parseISO(e.startsOn), 'd MMM yyyy')}
                </span>
                <span className="figure font-bold">
                  #{e.raceNumber} · {e.status === 'entered' ? 'entered' : 'awaiting payment'}
                </span>
              </li>
            ))}
          </ul>
          <Link href="/entries">All my entries</Link>
        </section>
      )}

      <section className="card space-y-3" aria-labelledby="declaration">
        <h2 id="declaration" className="text-xl">
          Declaration
        </h2>
        <dl className="grid gap-x-4 sm:grid-cols-[14rem_1fr] sm:gap-y-2" data-testid="declaration">
          {row('Hull', boat.hullDescription)}
          {row('Jet pump', boat.pumpDescription)}
          {row('Impeller', boat.impellerDescription)}
          {row(
            'Nozzle exit diameter',
            <span className="figure">
              {formatFigure(boat.declaredNozzleMm, 2)} mm ± {formatFigure(boat.declaredNozzleToleranceMm, 2)} mm (
              {formatFigure(Math.round((boat.declaredNozzleMm / 25.4) * 1000) / 1000, 3)} in)
            </span>,
          )}
          {row('Engine', boat.engineDescription)}
          {row(
            'Declared power',
            <span className="figure">
              {formatPowerFigure(boat.declaredPowerKw, 'powerKw')} (
              {formatPowerFigure(convertPower(boat.declaredPowerKw, 'kW', 'hp'), 'powerHp')})
            </span>,
          )}
          {row('Power backed by', POWER_EVIDENCE[boat.powerEvidence])}
          {row(
            'Displacement',
            boat.displacementL != null && <span className="figure">{formatFigure(boat.displacementL, 1)} L</span>,
          )}
          {row(
            'Weight',
            boat.declaredWeightKg != null && (
              <span className="figure">{formatFigure(boat.declaredWeightKg, 0)} kg</span>
            ),
          )}
        </dl>
        <details className="rounded-lg bg-paper-deep p-4">
          <summary className="min-h-touch cursor-pointer py-2 font-bold text-tide-700">
            Versions of the declaration ({declarationVersions.length})
          </summary>
          <p className="mt-2 text-sm text-ink-soft">
            Every change is kept as a new version. A change after an inspection asks the scrutineers to inspect the boat
            again before its earlier verdict counts.
          </p>
          <ol className="mt-2 divide-y divide-paper-line" data-testid="declaration-versions">
            {declarationVersions.map((v) => (
              <li key={v.version} className="py-2">
                <span className="figure font-bold">{`Version ${v.version}`}</span> ·{' '}
                {format(parseISO(v.createdAt), 'd MMM yyyy, HH:mm')} · {v.createdBy}
                <span className="block">{v.changes}</span>
              </li>
            ))}
          </ol>
        </details>
        <details className="rounded-lg bg-paper-deep p-4">
          <summary className="min-h-touch cursor-pointer py-2 font-bold text-tide-700">Edit the declaration</summary>
          <div className="mt-3">
            <BoatForm boat={boat} />
          </div>
        </details>
      </section>

      <section className="card space-y-3" aria-labelledby="curves">
        <h2 id="curves" className="text-xl">
          Engine and pump curves
        </h2>
        <p className="text-ink-soft">
          With both an engine curve and a pump curve, a class that chose the matched model reports this boat where its
          engine and pump settle, not at one fixed power.
        </p>
        <p data-testid="declared-performance">
          <span className="font-bold">Declared:</span> {describePerformance(boat.declaredPerformance)}
        </p>
        <details className="rounded-lg bg-paper-deep p-4">
          <summary className="min-h-touch cursor-pointer py-2 font-bold text-tide-700">Declare the curves</summary>
          <div className="mt-3">
            <PerformanceForm
              boatId={boat.id}
              declared={boat.declaredPerformance}
              catalogue={catalogue.map((c) => ({
                id: c.id,
                label: `${c.maker} ${c.model}${c.trimCode ? ` trim ${c.trimCode}` : ''}, ${c.impellerDiameterMm} mm (${c.eventName}, ${c.organisationName})`,
              }))}
            />
          </div>
        </details>
      </section>

      <ComponentsSection boat={{ id: boat.id, name: boat.name }} components={components} />

      <section className="card space-y-3" aria-labelledby="documents">
        <h2 id="documents" className="text-xl">
          Documents
        </h2>
        <p className="text-ink-soft">
          Dyno sheets, pump or engine specifications, certificates: PDF, PNG, JPEG or WebP, up to 10 MB each. Officials
          of the meetings you enter can read them.
        </p>
        {documents.length === 0 ? (
          <p className="text-ink-mute">No documents yet.</p>
        ) : (
          <ul className="divide-y divide-paper-line" data-testid="documents">
            {documents.map((d) => (
              <li key={d.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <span>
                  <a href={`/api/documents/${d.id}`}>{d.fileName}</a>
                  <span className="ml-2 text-sm text-ink-mute">
                    {DOCUMENT_KINDS[d.kind as keyof typeof DOCUMENT_KINDS] ?? d.kind} · {sizeText(d.sizeBytes)} ·{' '}
                    {format(parseISO(d.createdAt), 'd MMM yyyy')}
                  </span>
                </span>
                <span className="figure text-xs text-ink-mute" title="SHA-256 of the stored file">
                  SHA-256 {d.sha256.slice(0, 12)}…
                </span>
              </li>
            ))}
          </ul>
        )}
        <DocumentUploadForm boatId={boat.id} />
      </section>

      <section className="card space-y-3" aria-labelledby="tag">
        <h2 id="tag" className="text-xl">
          QR tag
        </h2>
        <p className="text-ink-soft">
          Print the tag and fix it where scrutineers can scan it at the dock. It opens this boat&apos;s record for
          officials; anyone else sees only its name and race number.
        </p>
        <div className="grid gap-4 sm:grid-cols-[auto_1fr] sm:items-start">
          {/* eslint-disable-next-line @next/next/no-img-element -- a data URL made on the server */}
          <img
            src={qr}
            alt={`QR tag for ${boat.name}`}
            width={200}
            height={200}
            className="rounded-lg border border-paper-line bg-white"
            data-testid="tag-qr"
          />
          <div className="min-w-0 space-y-2">
            <p className="break-all text-sm">
              <span className="font-bold">Tag link:</span> <span data-testid="tag-url">{tag.url}</span>
            </p>
            <p className="text-sm text-ink-mute">Issued {format(parseISO(tag.issuedAt), 'd MMM yyyy, HH:mm')}</p>
            <a href={`/api/boats/${boat.id}/tag-pdf`} className="btn-secondary" download>
              Download tag (PDF)
            </a>
          </div>
        </div>
        <ReissueTagButton boatId={boat.id} />
      </section>
    </div>
  );
}
