import { SectionLoading } from '@/components/section-states';

export default function ProtestsLoading() {
  return <SectionLoading label="Loading your protests…" />;
}
