import { listPendingInvitations, listTeamMembers } from '@/db/queries/members';
import { teamSizingOptions } from '@/db/queries/teams';
import { DEFAULT_MIN_PARALLEL_SECTION_MM2 } from '@/lib/schedule';
import { TeamSizingSettings } from '@/components/team/TeamSizingSettings';
import { requirePageUser } from '@/server/auth/session';
import { MembersAdmin } from './MembersAdmin';
import { setMinParallelSectionAction } from './teamSettingsActions';
import { TeamCurrency } from './TeamCurrency';
import { setTeamCurrencyAction } from './currencyAction';

export const metadata = { title: 'Members' };
export const dynamic = 'force-dynamic';

export default async function MembersPage() {
  const user = await requirePageUser('members:manage');
  const [members, invitations, sizing] = await Promise.all([listTeamMembers(user.teamId), listPendingInvitations(user.teamId), teamSizingOptions(user.teamId)]);
  return (
    <section aria-labelledby="members-heading" className="max-w-5xl">
      <h1 id="members-heading" className="text-title">
        Members of {user.teamName}
      </h1>
      <p className="mt-2 text-ink-600">Invite colleagues by e-mail, change what they may do, or close their access.</p>
      <TeamCurrency currency={user.teamCurrency} onChange={setTeamCurrencyAction} />
      <MembersAdmin
        currentUserId={user.id}
        members={members.map((m) => ({ ...m, createdAt: m.createdAt.toISOString() }))}
        invitations={invitations.map((i) => ({ ...i, createdAt: i.createdAt.toISOString(), expiresAt: i.expiresAt.toISOString() }))}
      />
      <TeamSizingSettings
        minParallelSectionMm2={sizing.minParallelSectionMm2 ?? null}
        defaultMinParallelSectionMm2={DEFAULT_MIN_PARALLEL_SECTION_MM2}
        action={setMinParallelSectionAction}
      />
    </section>
  );
}
