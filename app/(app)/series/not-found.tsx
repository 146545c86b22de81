import { SectionNotFound } from '@/components/section-states';

// Shown when a page of this section calls notFound(): an address that names no series or class.
export default function SeriesNotFound() {
  return (
    <SectionNotFound title="No such series class" backHref="/home" backLabel="Home">
      The link may be mistyped, or the class is not in this series.
    </SectionNotFound>
  );
}
