import { SectionLoading } from '@/components/section-states';

export default function QueueLoading() {
  return <SectionLoading label="Loading the dock queue…" />;
}
