import { SectionLoading } from '@/components/section-states';

export default function AuditLoading() {
  return <SectionLoading label="Loading the audit trail…" />;
}
