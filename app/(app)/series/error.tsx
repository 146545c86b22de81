'use client';

import { SectionError } from '@/components/section-states';

// Shown when a page of this section fails; retry() fetches it from the server again.
export default function SeriesError({ retry }: { error: unknown; retry: () => void }) {
  return <SectionError title="The series page could not be loaded" retry={retry} />;
}
