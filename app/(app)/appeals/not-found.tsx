import { SectionNotFound } from '@/components/section-states';

// Shown when a page of this section calls notFound(): an address that names nothing here.
export default function AppealsNotFound() {
  return (
    <SectionNotFound title="No such appeal among yours" backHref="/appeals" backLabel="Appeals">
      The link may be mistyped, or the appeal is not one you may read.
    </SectionNotFound>
  );
}
