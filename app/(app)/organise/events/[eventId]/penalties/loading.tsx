import { SectionLoading } from '@/components/section-states';

export default function PenaltyCatalogueLoading() {
  return <SectionLoading label="Loading the penalty catalogue…" />;
}
