import { SectionLoading } from '@/components/section-states';

export default function MeetingLoading() {
  return <SectionLoading label="Loading the meeting…" />;
}
