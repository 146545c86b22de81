import { SectionLoading } from '@/components/section-states';

export default function IncidentsLoading() {
  return <SectionLoading label="Loading the incidents…" />;
}
