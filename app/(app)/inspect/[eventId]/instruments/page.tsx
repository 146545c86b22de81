import type { Metadata } from 'next';
import Link from '@/components/link';
import { openInstruments } from '../access';
import { listAllInstruments } from '@/lib/server/inspections/list-instruments';
import { canManageInstruments } from '@/lib/server/inspections/manage-instruments-access';
import { formatFigure } from '@/lib/core/format/figures';
import { AddInstrumentForm, RetireInstrumentButton } from './instrument-forms';
import { AddCertificateForm, RecordCheckForm } from './calibration-forms';
import { INSTRUMENT_TYPE_LABELS, type InstrumentType } from '@/lib/core/inputs/instrument-calibration';
import type { CalibrationStatus } from '@/lib/core/inspections/calibration-state';

const STATE_LABEL: Record<CalibrationStatus, string> = {
  valid: 'Calibrated',
  no_certificate: 'No certificate on file',
  overdue: 'Calibration overdue: cannot be chosen',
  failed_check: 'Out of use today: failed its check',
};
const STATE_CLASS: Record<CalibrationStatus, string> = {
  valid: 'border-pass-600 bg-pass-100',
  no_certificate: 'border-paper-line',
  overdue: 'border-fail-600 bg-fail-100',
  failed_check: 'border-fail-600 bg-fail-100',
};

export const metadata: Metadata = { title: 'Measuring instruments' };
export const dynamic = 'force-dynamic';

const U_KIND = { length: 'uncertaintyMm', mass: 'massKg' } as const;

// The meeting's measuring instruments: the chief scrutineer (or organiser) adds and retires them; scrutineers see the list.
export default async function InstrumentsPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openInstruments(params);
  const instruments = await listAllInstruments(actor, eventId);
  const canManage = canManageInstruments(actor, eventId);
  const inService = instruments.filter((i) => !i.retiredAt);
  const retired = instruments.filter((i) => i.retiredAt);
  return (
    <div className="space-y-5 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/inspect">Inspect</Link> / <Link href={`/inspect/${eventId}/board`}>{event.name}</Link> /
        Instruments
      </nav>
      <h1>Measuring instruments</h1>
      <p className="text-ink-soft">
        The instruments the scrutineers may choose at the dock. Each brings its expanded uncertainty U (k = 2) to the
        verdicts: from its certificate, or from its error limit a and resolution δ as U = 2·√(a²/3 + δ²/12) (JCGM
        100:2008). An instrument whose certificate is past its due date, or that failed its check against a reference
        today ({event.timeZone}), cannot be chosen at the dock. Officials decide every verdict.
      </p>
      {canManage ? (
        <AddInstrumentForm eventId={eventId} />
      ) : (
        <p>Only the chief scrutineer or the organiser adds and retires instruments.</p>
      )}
      <section aria-labelledby="in-service-heading" className="space-y-3">
        <h2 id="in-service-heading" className="text-xl">
          In service ({inService.length})
        </h2>
        {inService.length === 0 ? (
          <p>None yet: the dock falls back on a typed U or the class default.</p>
        ) : (
          <ul className="space-y-3" data-testid="instruments-in-service">
            {inService.map((i) => (
              <li key={i.id} className="card space-y-2" data-instrument-id={i.id}>
                <div className="flex flex-wrap items-start justify-between gap-2">
                  <div>
                    <p className="font-bold">{i.name}</p>
                    <p className="text-ink-soft">
                      {i.quantity === 'length' ? 'Length (mm)' : 'Mass (kg)'} · U{' '}
                      <span className="figure">{formatFigure(i.appliedExpandedUncertainty, U_KIND[i.quantity])}</span>
                    </p>
                    <p className="text-base text-ink-soft">{i.basis}</p>
                    {(i.instrumentType || i.serial || i.rangeMax != null || i.material) && (
                      <p className="text-base text-ink-soft">
                        {[
                          i.instrumentType &&
                            (INSTRUMENT_TYPE_LABELS[i.instrumentType as InstrumentType] ?? i.instrumentType),
                          i.serial && `serial ${i.serial}`,
                          i.rangeMax != null && `range ${i.rangeMin ?? 0} to ${i.rangeMax}`,
                          i.material,
                        ]
                          .filter(Boolean)
                          .join(' · ')}
                      </p>
                    )}
                    <p
                      className={`mt-1 inline-block rounded border-2 px-2 text-base ${STATE_CLASS[i.calibration.status]}`}
                      data-calibration-status={i.calibration.status}
                    >
                      <span className="font-bold">{STATE_LABEL[i.calibration.status]}</span>: {i.calibration.reason}
                      {i.calibration.certificate && ` · ${i.calibration.certificate.laboratory}`}
                    </p>
                    {i.calibration.certificate?.hasFile && (
                      <p className="text-base">
                        <a
                          href={`/api/events/${eventId}/instruments/${i.id}/certificates/${i.calibration.certificate.id}/file`}
                          download
                        >
                          Certificate {i.calibration.certificate.number} (file)
                        </a>
                      </p>
                    )}
                  </div>
                  {canManage && <RetireInstrumentButton eventId={eventId} instrumentId={i.id} name={i.name} />}
                </div>
                {canManage && (
                  <div className="flex flex-wrap gap-2">
                    <AddCertificateForm eventId={eventId} instrumentId={i.id} name={i.name} />
                    <RecordCheckForm
                      eventId={eventId}
                      instrumentId={i.id}
                      name={i.name}
                      errorLimit={i.errorLimit}
                      unit={i.quantity === 'mass' ? 'kg' : 'mm'}
                    />
                  </div>
                )}
              </li>
            ))}
          </ul>
        )}
      </section>
      {retired.length > 0 && (
        <section aria-labelledby="retired-heading" className="space-y-2">
          <h2 id="retired-heading" className="text-xl">
            Retired ({retired.length})
          </h2>
          <ul className="divide-y divide-paper-line" data-testid="instruments-retired">
            {retired.map((i) => (
              <li key={i.id} className="py-2" data-instrument-id={i.id}>
                <span className="font-bold">{i.name}</span> · retired{' '}
                {new Date(i.retiredAt!).toLocaleString('en-GB', {
                  dateStyle: 'medium',
                  timeStyle: 'short',
                  timeZone: event.timeZone,
                })}{' '}
                ({event.timeZone}); records made with it keep it.
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
