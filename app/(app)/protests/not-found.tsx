import { SectionNotFound } from '@/components/section-states';

// Shown when a page of this section calls notFound(): an address that names nothing here.
export default function ProtestsNotFound() {
  return (
    <SectionNotFound title="No such protest among yours" backHref="/protests" backLabel="My protests">
      The link may be mistyped, or the protest is not one you lodged or one against your boat.
    </SectionNotFound>
  );
}
