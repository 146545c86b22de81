'use client';

import { SectionError } from '@/components/section-states';

// Shown when a page of this section fails; retry() fetches it from the server again.
export default function AppealsError({ retry }: { error: unknown; retry: () => void }) {
  return <SectionError title="The appeals could not be loaded" retry={retry} />;
}
