import { SectionLoading } from '@/components/section-states';

export default function SlotPageLoading() {
  return <SectionLoading label="Loading the scrutineering slots…" />;
}
