// Where the test run's app, database and fakes live (set by scripts/test.sh).
export const BASE_URL = `http://localhost:${process.env.PORT ?? 3100}`;
export const MAIL_INBOX = `http://127.0.0.1:${process.env.MAIL_FAKE_HTTP_PORT ?? 2626}/messages`;
export const ARTIFACTS = process.env.TEST_ARTIFACTS ?? 'test-results';
export const DEMO_PASSWORD = 'tarnwater-demo';
export const DEMO = {
  admin: 'admin@boreline.example',
  organiser: 'organiser@tarnwater.example',
  chief: 'chief@tarnwater.example',
  scrutineer: 'scrutineer@tarnwater.example',
  steward: 'steward@tarnwater.example',
  entrant: 'entrant@tarnwater.example',
  appealBody: 'appeals@boreline.example',
  meetingId: '0b0e0000-0000-4000-8000-000000000101',
} as const;

/** A unique e-mail address for one test. */
export function uniqueEmail(prefix = 'tester') {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}@example.org`;
}
