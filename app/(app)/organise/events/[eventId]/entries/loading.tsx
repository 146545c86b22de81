import { SectionLoading } from '@/components/section-states';

export default function EntriesLoading() {
  return <SectionLoading label="Loading the entries…" />;
}
