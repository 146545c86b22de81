import { SectionLoading } from '@/components/section-states';

export default function PenaltiesLoading() {
  return <SectionLoading label="Loading the penalties…" />;
}
