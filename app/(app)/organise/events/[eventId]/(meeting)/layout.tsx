import { openMeeting } from '../access';

// Decides the meeting page's status (sign-in, 404, permission) before its loading.tsx streams anything (see access.ts).
export default async function MeetingAccess({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ eventId: string }>;
}) {
  await openMeeting(params);
  return children;
}
