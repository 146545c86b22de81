import { SectionNotFound } from '@/components/section-states';

// Shown when a page of this section calls notFound(): an address that names nothing here.
export default function InspectNotFound() {
  return (
    <SectionNotFound title="No such meeting to inspect" backHref="/inspect" backLabel="Your meetings to inspect">
      The link may be mistyped or out of date. Your meetings are listed on the Inspect page.
    </SectionNotFound>
  );
}
