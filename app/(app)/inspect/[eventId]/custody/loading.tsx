import { SectionLoading } from '@/components/section-states';

export default function CustodyLoading() {
  return <SectionLoading label="Loading the parts in custody…" />;
}
