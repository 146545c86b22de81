import { SectionLoading } from '@/components/section-states';

export default function InstrumentsLoading() {
  return <SectionLoading label="Loading the instruments…" />;
}
