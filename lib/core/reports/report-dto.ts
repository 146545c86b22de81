import type { ParityReport } from '@/models';
import type { ReportInputs, ReportResults } from './parity-figures';

export type PublishedReportDto = {
  id: string;
  publicId: string;
  eventId: string;
  classId: string;
  number: number;
  note: string;
  publishedAt: string;
  inputs: ReportInputs;
  results: ReportResults;
};

export const toPublishedReportDto = (r: ParityReport): PublishedReportDto => ({
  id: r.id,
  publicId: r.publicId,
  eventId: r.eventId,
  classId: r.classId,
  number: r.number,
  note: r.note,
  publishedAt: r.publishedAt.toISOString(),
  inputs: r.inputs,
  results: r.results,
});
