import { SectionLoading } from '@/components/section-states';

export default function InspectLoading() {
  return <SectionLoading label="Loading the inspection…" />;
}
