import { SectionLoading } from '@/components/section-states';

export default function TimingLoading() {
  return <SectionLoading label="Loading the run times…" />;
}
