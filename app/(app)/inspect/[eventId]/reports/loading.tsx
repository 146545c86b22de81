import { SectionLoading } from '@/components/section-states';

export default function ReportsLoading() {
  return <SectionLoading label="Loading the reports…" />;
}
