import { SectionLoading } from '@/components/section-states';

export default function AppealsLoading() {
  return <SectionLoading label="Loading the appeals…" />;
}
