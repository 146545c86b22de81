import { SectionLoading } from '@/components/section-states';

export default function AppealLoading() {
  return <SectionLoading label="Loading the appeal…" />;
}
