import { SectionLoading } from '@/components/section-states';

export default function InterestsLoading() {
  return <SectionLoading label="Loading the declared interests…" />;
}
