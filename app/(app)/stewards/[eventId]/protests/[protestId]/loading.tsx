import { SectionLoading } from '@/components/section-states';

export default function StewardProtestLoading() {
  return <SectionLoading label="Loading the protest…" />;
}
