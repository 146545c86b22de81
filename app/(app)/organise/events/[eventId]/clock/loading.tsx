import { SectionLoading } from '@/components/section-states';

export default function ClockLoading() {
  return <SectionLoading label="Working out the predicted runs…" />;
}
