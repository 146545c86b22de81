import { SectionLoading } from '@/components/section-states';

export default function DockLoading() {
  return <SectionLoading label="Loading the dock screen…" />;
}
