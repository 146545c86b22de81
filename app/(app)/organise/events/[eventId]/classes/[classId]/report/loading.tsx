import { SectionLoading } from '@/components/section-states';

export default function ClassReportLoading() {
  return <SectionLoading label="Loading the parity report…" />;
}
