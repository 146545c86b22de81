import { SectionLoading } from '@/components/section-states';

export default function OrganiseLoading() {
  return <SectionLoading label="Loading the meeting…" />;
}
