import { SectionLoading } from '@/components/section-states';

export default function ResultsLoading() {
  return <SectionLoading label="Loading the provisional results…" />;
}
