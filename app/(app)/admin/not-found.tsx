import { SectionNotFound } from '@/components/section-states';

// Shown when a page of this section calls notFound(): an address that names nothing here.
export default function AdminNotFound() {
  return (
    <SectionNotFound title="Nothing here in administration" backHref="/admin" backLabel="Administration">
      The link may be mistyped or out of date.
    </SectionNotFound>
  );
}
