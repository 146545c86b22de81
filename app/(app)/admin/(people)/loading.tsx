import { SectionLoading } from '@/components/section-states';

export default function AdminLoading() {
  return <SectionLoading label="Loading the administration page…" />;
}
