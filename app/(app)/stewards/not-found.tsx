import { SectionNotFound } from '@/components/section-states';

// Shown when a page of this section calls notFound(): an address that names nothing here.
export default function StewardsNotFound() {
  return (
    <SectionNotFound title="No such meeting or protest" backHref="/stewards" backLabel="Your meetings as a steward">
      The link may be mistyped or out of date. Your meetings are listed on the Stewards page.
    </SectionNotFound>
  );
}
