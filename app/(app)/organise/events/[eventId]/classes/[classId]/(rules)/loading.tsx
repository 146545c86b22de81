import { SectionLoading } from '@/components/section-states';

export default function ClassRulesLoading() {
  return <SectionLoading label="Loading the class rules…" />;
}
