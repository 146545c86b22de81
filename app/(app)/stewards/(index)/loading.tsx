import { SectionLoading } from '@/components/section-states';

export default function StewardsLoading() {
  return <SectionLoading label="Loading the protests…" />;
}
