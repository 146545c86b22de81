import { SectionLoading } from '@/components/section-states';

export default function SlotsLoading() {
  return <SectionLoading label="Loading the scrutineering slots…" />;
}
