import { SectionNotFound } from '@/components/section-states';

// Shown when a page of this section calls notFound(): an address that names nothing here.
export default function OrganiseNotFound() {
  return (
    <SectionNotFound title="No such meeting, class or report" backHref="/organise" backLabel="Meetings you organise">
      The link may be mistyped or out of date. The meetings you organise are listed on the Organise page.
    </SectionNotFound>
  );
}
