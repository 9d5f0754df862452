import type { Metadata } from 'next';
import { AppError } from '@/lib/errors';
import { getDb } from '@/lib/server/db';
import { getJoinStudy } from '@/lib/server/services/participant-sessions';
import { InviteTokenSchema, type JoinStudyValue } from '@/lib/schemas/participant-session';
import { ParticipantSession } from '@/components/participant-session';

export const metadata: Metadata = { title: 'Study', robots: { index: false } };

function Notice({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <main className="mx-auto max-w-xl space-y-4 px-6 py-16">
      <h1 className="text-2xl font-semibold" data-testid="join-notice">{title}</h1>
      <p>{children}</p>
    </main>
  );
}

async function loadStudy(token: string): Promise<JoinStudyValue | { missing: string }> {
  try {
    return await getJoinStudy(getDb(), token);
  } catch (error) {
    if (error instanceof AppError && error.kind === 'not_found') return { missing: error.message };
    throw error;
  }
}

/**
 * The participant shell: no lab navigation, no query client; one client component runs the session. A closed
 * study still lets a participant who started before it closed finish (the component resumes a stored session).
 */
export default async function JoinPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  if (!InviteTokenSchema.safeParse(token).success) return <Notice title="This link is not valid">Check that you copied the whole link, or ask the lab for it again.</Notice>;
  const study = await loadStudy(token);
  if ('missing' in study) return <Notice title="This link no longer works">{study.missing}</Notice>;
  return <ParticipantSession token={token} study={study} />;
}
