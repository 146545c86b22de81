import { SectionLoading } from '@/components/section-states';

export default function BoardLoading() {
  return <SectionLoading label="Loading the inspection board…" />;
}
