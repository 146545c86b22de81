import { SectionLoading } from '@/components/section-states';

export default function SealsLoading() {
  return <SectionLoading label="Loading the seal register…" />;
}
