import { SectionLoading } from '@/components/section-states';

export default function ProtestLoading() {
  return <SectionLoading label="Loading the protest…" />;
}
